import { href, isRouteErrorResponse, Link } from "react-router";
import { buttonClass } from "./ui/Button";

/** Title and text of each status; `advice` follows a route's own explanation when it gives one. */
const copy: Record<number, { title: string; text: string; advice?: string }> = {
  400: {
    title: "That request did not make sense",
    text: "Something in the address or the form was not what this page expects.",
  },
  401: { title: "Please sign in", text: "This page belongs to a signed-in account." },
  403: {
    title: "This page is not yours to open",
    text: "Your account does not have the role this page needs.",
    advice: "If you think it should, ask the array's administrator.",
  },
  404: { title: "Nothing here", text: "The page you asked for does not exist, or it has moved." },
  500: {
    title: "Something went wrong on our side",
    text: "The error has been logged. Your saved work is safe; please try again in a moment.",
  },
};

/** The one error page for 403/404/500 and friends, used by every route's boundary. */
export function ErrorPage({ error }: { error: unknown }) {
  let status = 500;
  let detail: string | null = null;
  if (isRouteErrorResponse(error)) {
    status = error.status;
    if (typeof error.data === "string" && error.data && status < 500) detail = error.data;
  } else if (import.meta.env.DEV && error instanceof Error) {
    detail = error.message;
  }
  const text = copy[status] ?? (status >= 500 ? copy[500] : copy[400]);
  return (
    <div className="mx-auto max-w-xl py-12 text-center">
      <p className="num text-sm font-semibold tracking-widest text-ember-700">ERROR {status}</p>
      <h1 className="mt-2 text-3xl font-semibold">{text.title}</h1>
      {/* The route's own explanation replaces the generic text, so nothing is said twice. */}
      <p className="mt-3 text-night-700">{detail ?? text.text}</p>
      {text.advice ? <p className="mt-3 text-sm text-night-600">{text.advice}</p> : null}
      <div className="mt-6 flex justify-center gap-3">
        <Link to={href("/")} className={buttonClass("primary")}>
          Go to the home page
        </Link>
      </div>
    </div>
  );
}
