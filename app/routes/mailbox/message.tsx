import { href, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, Badge, Card, type Detail, DetailList, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { requireMailboxReader } from "~/lib/guards.server";
import { invariantResponse } from "~/lib/not-found";
import { messageView, parseMessageId } from "~/services/mailbox/queries.server";
import { attemptsText, Recipient, StatusBadge } from "./+shared/parts";
import type { Route } from "./+types/message";

const NO_SUCH_MESSAGE = "There is no message with that number.";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  const viewer = await requireMailboxReader(request);
  const id = parseMessageId(params.messageId);
  invariantResponse(id, NO_SUCH_MESSAGE);
  const reader = { email: viewer.user.email, readsAll: viewer.readsAll };
  // Somebody else's message is "no such message" to a reader who may not read it.
  const message = await messageView(context.get(dbContext), { id, reader });
  invariantResponse(message, NO_SUCH_MESSAGE);
  return { message };
}

export const meta: Route.MetaFunction = ({ loaderData }) => [
  { title: loaderData ? `${loaderData.message.subject} — Mailbox — Fringe Docket` : "Mailbox — Fringe Docket" },
];

type Message = Route.ComponentProps["loaderData"]["message"];

const URL_PATTERN = /(https?:\/\/[^\s<>"')\]]+)/g;

/** The plain-text alternative with its web addresses made clickable (the HTML preview is sandboxed). */
function LinkedText({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <pre className="overflow-x-auto whitespace-pre-wrap break-words rounded-lg bg-night-50 p-4 font-mono text-sm text-night-800 ring-1 ring-night-200">
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <a key={i} href={part} rel="noreferrer" className="text-ember-700 underline">
            {part}
          </a>
        ) : (
          part
        ),
      )}
    </pre>
  );
}

/** Where the message stands: delivered (and when), queued, retrying with the failed attempts so far, or given up. */
function Delivery({ message: m }: { message: Message }) {
  if (m.status === "queued") return <StatusBadge status="queued" />;
  const when =
    m.status === "delivered"
      ? m.sent
      : m.status === "abandoned"
        ? `given up ${m.abandoned}`
        : `${attemptsText(m.attempts, "failed")}, next ${m.nextAttempt}`;
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <StatusBadge status={m.status} />
      <span className="num">{when}</span>
    </span>
  );
}

/** The header lines of the message; the last error, Message-ID and related page only when there are any. */
function headerDetails(m: Message): Detail[] {
  const details: Detail[] = [
    { label: "To", value: <Recipient to={m.to} toViewer={m.toViewer} /> },
    { label: "Subject", value: m.subject },
    { label: "Kind", value: <Badge>{m.kind}</Badge> },
    { label: "Written", value: <span className="num">{m.created}</span> },
    { label: "Status", value: <Delivery message={m} /> },
  ];
  if (m.lastError)
    details.push({ label: "Last error", value: <span className="break-words text-danger-700">{m.lastError}</span> });
  if (m.smtpMessageId)
    details.push({ label: "Message-ID", value: <code className="break-all text-sm">{m.smtpMessageId}</code> });
  if (m.relatedUrl) {
    const link = (
      <a href={m.relatedUrl} rel="noreferrer" className="break-all text-ember-700 underline">
        {m.relatedUrl}
      </a>
    );
    details.push({ label: "Related page", value: link });
  }
  return details;
}

export default function MailboxMessage({ loaderData }: Route.ComponentProps) {
  const { message: m } = loaderData;
  const mailbox = href("/mailbox");
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link to={mailbox} className="text-ember-700 underline-offset-2 hover:underline">
          Mailbox
        </Link>
        <span className="text-night-500"> / message {m.id}</span>
      </nav>
      <PageHeader title={m.subject} back={{ to: mailbox, label: "Back to the mailbox" }} />
      <div className="page-stack">
        {m.linkHiddenUntil ? (
          <Alert tone="info">
            This message carries a one-time sign-in link that is still valid, so it is hidden here: only its recipient
            may use it. It is shown once it has been used or has expired ({m.linkHiddenUntil} at the latest).
          </Alert>
        ) : null}
        <Card title="Headers">
          <DetailList
            items={headerDetails(m)}
            className="grid grid-cols-1 gap-x-6 gap-y-2 sm:grid-cols-[10rem_1fr]"
            itemClassName="contents"
            valueClassName="text-night-900"
          />
        </Card>
        <Card title="As the recipient sees it">
          <iframe
            sandbox=""
            srcDoc={m.html}
            title={`HTML of message ${m.id}`}
            className="h-[40rem] w-full rounded-lg bg-white ring-1 ring-night-200"
          />
          <p className="mt-2 text-sm text-night-600">
            Shown in a sandbox: links do not open here; use the plain text below.
          </p>
        </Card>
        <Card title="Plain-text alternative">
          <LinkedText text={m.text} />
        </Card>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
