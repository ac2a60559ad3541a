import type { ReactNode } from "react";
import { data, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { Badge, ButtonLink, Card, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { requireMailboxReader } from "~/lib/guards.server";
import { getMessage, mailStatus, parseMessageId, utcText } from "~/services/mail/mailbox.server";
import type { Route } from "./+types/message";

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await requireMailboxReader(request);
  const id = parseMessageId(params.messageId);
  if (id === null) throw data("There is no message with that number.", { status: 404 });
  const message = await getMessage(database(), id);
  if (!message) throw data("There is no message with that number.", { status: 404 });
  return {
    message: {
      id: message.id,
      kind: message.kind,
      to: message.toAddress,
      toViewer: message.toAddress.toLowerCase() === viewer.user.email.toLowerCase(),
      subject: message.subject,
      html: message.html,
      text: message.text,
      relatedUrl: message.relatedUrl && /^https?:\/\//i.test(message.relatedUrl) ? message.relatedUrl : null,
      created: utcText(message.createdAt),
      status: mailStatus(message),
      attempts: message.attempts,
      nextAttempt: utcText(message.nextAttemptAt),
      lastError: message.lastError,
      sent: utcText(message.sentAt),
      smtpMessageId: message.smtpMessageId,
    },
  };
}

export const meta: Route.MetaFunction = ({ loaderData }) => [
  { title: loaderData ? `${loaderData.message.subject} — Mailbox — Fringe Docket` : "Mailbox — Fringe Docket" },
];

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

export default function MailboxMessage({ loaderData }: Route.ComponentProps) {
  const { message: m } = loaderData;
  const headers: [string, ReactNode][] = [
    [
      "To",
      <span className="inline-flex flex-wrap items-center gap-1.5">
        <span className="break-all">{m.to}</span>
        {m.toViewer ? <Badge tone="accent">you</Badge> : null}
      </span>,
    ],
    ["Subject", m.subject],
    ["Kind", <Badge>{m.kind}</Badge>],
    ["Written", <span className="num">{m.created}</span>],
    [
      "Status",
      m.status === "sent" ? (
        <span className="inline-flex items-center gap-2">
          <Badge tone="ok">sent</Badge>
          <span className="num">{m.sent}</span>
        </span>
      ) : m.status === "pending" ? (
        <Badge tone="info">pending</Badge>
      ) : (
        <span className="inline-flex flex-wrap items-center gap-2">
          <Badge tone="caution">retrying</Badge>
          <span className="num">
            {m.attempts} failed {m.attempts === 1 ? "attempt" : "attempts"}, next {m.nextAttempt}
          </span>
        </span>
      ),
    ],
  ];
  if (m.lastError) headers.push(["Last error", <span className="break-words text-danger-700">{m.lastError}</span>]);
  if (m.smtpMessageId) headers.push(["Message-ID", <code className="break-all text-sm">{m.smtpMessageId}</code>]);
  if (m.relatedUrl)
    headers.push([
      "Related page",
      <a href={m.relatedUrl} rel="noreferrer" className="break-all text-ember-700 underline">
        {m.relatedUrl}
      </a>,
    ]);

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm">
        <Link to="/mailbox" className="text-ember-700 underline-offset-2 hover:underline">
          Mailbox
        </Link>
        <span className="text-night-500"> / message {m.id}</span>
      </nav>
      <PageHeader
        title={m.subject}
        actions={
          <ButtonLink to="/mailbox" variant="secondary">
            Back to the mailbox
          </ButtonLink>
        }
      />
      <div className="grid gap-6">
        <Card title="Headers">
          <dl className="grid grid-cols-1 gap-x-6 gap-y-2 sm:grid-cols-[10rem_1fr]">
            {headers.map(([label, value]) => (
              <div key={label} className="contents">
                <dt className="text-sm text-night-600">{label}</dt>
                <dd className="text-night-900">{value}</dd>
              </div>
            ))}
          </dl>
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
