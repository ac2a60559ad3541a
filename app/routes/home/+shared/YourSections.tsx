import { href, Link, useRouteLoaderData } from "react-router";
import { cardClass } from "~/components/ui";
import type { loader as rootLoader } from "~/root";

const inlineLink = "font-medium text-ember-700 underline underline-offset-2";

/** For a visitor: how to start, and that the registry is open to everyone. */
function StartHere() {
  return (
    <section aria-labelledby="start" className={cardClass("p-5")}>
      <h2 id="start" className="text-lg font-semibold">
        Start here
      </h2>
      <p className="mt-1 text-night-700">
        <Link to={href("/sign-in")} className={inlineLink}>
          Sign in
        </Link>{" "}
        with the observatory's single sign-on or an e-mail link to sketch coverage, keep a target list and write
        proposals. The{" "}
        <Link to={href("/registry")} className={inlineLink}>
          array registry
        </Link>{" "}
        is open to everyone.
      </p>
    </section>
  );
}

/** The viewer's own sections with a line each, or an invitation to sign in. */
export function YourSections() {
  const root = useRouteLoaderData<typeof rootLoader>("root");
  if (!root) return null;
  if (!root.viewer) return <StartHere />;
  return (
    <section aria-labelledby="yours">
      <h2 id="yours" className="text-xl font-semibold">
        Your sections, {root.viewer.name}
      </h2>
      <ul className="mt-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {root.sections.map((s) => (
          <li key={s.to}>
            <Link to={s.to} className={cardClass("block h-full p-4 hover:ring-ember-500")}>
              <span className="font-semibold text-ember-800">{s.label}</span>
              <span className="mt-1 block text-sm text-night-700">{s.summary}</span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
