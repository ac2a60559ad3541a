import { Form, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import {
  Badge,
  type BadgeTone,
  Button,
  ButtonLink,
  Card,
  type Column,
  DataTable,
  EmptyState,
  PageHeader,
  TextField,
} from "~/components/ui";
import { database } from "~/db/client.server";
import { requireMailboxReader } from "~/lib/guards.server";
import { listMessages, type MailStatus, mailStatus, parseMailboxQuery, utcText } from "~/services/mail/mailbox.server";
import type { Route } from "./+types/index";

export async function loader({ request, url }: Route.LoaderArgs) {
  const viewer = await requireMailboxReader(request);
  const query = parseMailboxQuery(url.searchParams);
  const result = await listMessages(database(), query);
  const viewerEmail = viewer.user.email.toLowerCase();
  return {
    q: result.q,
    page: result.page,
    pageCount: result.pageCount,
    pageSize: result.pageSize,
    total: result.total,
    rows: result.rows.map((m) => ({
      id: m.id,
      kind: m.kind,
      to: m.toAddress,
      toViewer: m.toAddress.toLowerCase() === viewerEmail,
      subject: m.subject,
      createdAt: m.createdAt.toISOString(),
      created: utcText(m.createdAt) ?? "",
      status: mailStatus(m),
      attempts: m.attempts,
      nextAttempt: utcText(m.nextAttemptAt),
      lastError: m.lastError,
      sent: utcText(m.sentAt),
    })),
  };
}

export const meta: Route.MetaFunction = () => [{ title: "Mailbox — Fringe Docket" }];

type Row = Route.ComponentProps["loaderData"]["rows"][number];

const statusTone: Record<MailStatus, BadgeTone> = { sent: "ok", pending: "info", retrying: "caution" };

function StatusCell({ row }: { row: Row }) {
  if (row.status === "sent") return <Badge tone="ok">sent</Badge>;
  if (row.status === "pending") return <Badge tone={statusTone.pending}>pending</Badge>;
  return (
    <div className="space-y-1">
      <Badge tone="caution">
        retrying · {row.attempts} {row.attempts === 1 ? "attempt" : "attempts"}
      </Badge>
      <p className="text-xs text-night-600">next {row.nextAttempt}</p>
      {row.lastError ? (
        <p className="max-w-xs truncate text-xs text-danger-700" title={row.lastError}>
          {row.lastError}
        </p>
      ) : null}
    </div>
  );
}

const columns: Column<Row>[] = [
  {
    key: "created",
    header: "Created",
    value: (m) => m.createdAt,
    render: (m) => <span className="num whitespace-nowrap">{m.created}</span>,
  },
  {
    key: "to",
    header: "To",
    value: (m) => m.to,
    render: (m) => (
      <span className="inline-flex flex-wrap items-center gap-1.5">
        <span className="break-all">{m.to}</span>
        {m.toViewer ? <Badge tone="accent">you</Badge> : null}
      </span>
    ),
  },
  {
    key: "subject",
    header: "Subject",
    value: (m) => m.subject,
    render: (m) => (
      <Link to={`/mailbox/${m.id}`} className="font-medium text-ember-700 underline-offset-2 hover:underline">
        {m.subject}
      </Link>
    ),
  },
  { key: "kind", header: "Kind", value: (m) => m.kind, render: (m) => <Badge>{m.kind}</Badge> },
  {
    key: "status",
    header: "Status",
    value: (m) => (m.status === "retrying" ? `retrying (${m.attempts})` : m.status),
    render: (m) => <StatusCell row={m} />,
  },
];

function pageHref(q: string, page: number) {
  const params = new URLSearchParams();
  if (q) params.set("q", q);
  if (page > 1) params.set("page", String(page));
  const search = params.toString();
  return search ? `/mailbox?${search}` : "/mailbox";
}

export default function Mailbox({ loaderData }: Route.ComponentProps) {
  const { q, page, pageCount, pageSize, total, rows } = loaderData;
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <>
      <PageHeader
        title="Mailbox"
        lead="Every e-mail Fringe Docket has written, newest first: delivered, waiting for its first attempt, or retrying while the mail server does not answer."
      />
      <div className="grid gap-6">
        <Form method="get" action="/mailbox" role="search" className="flex flex-wrap items-end gap-3">
          <div className="min-w-64 flex-1">
            <TextField label="Search by address or subject" name="q" type="search" defaultValue={q} maxLength={200} />
          </div>
          <Button type="submit">Search</Button>
          {q ? (
            <ButtonLink to="/mailbox" variant="secondary">
              Show all
            </ButtonLink>
          ) : null}
        </Form>

        {total === 0 ? (
          q ? (
            <EmptyState title={`No message matches “${q}”`}>
              Try part of an address, or another word from the subject.
            </EmptyState>
          ) : (
            <EmptyState title="No messages yet">
              Messages show up here as soon as the app writes them: a sign-in link, a change of roles, a decision.
            </EmptyState>
          )
        ) : (
          <Card
            title={q ? `Messages matching “${q}”` : "Messages"}
            actions={
              <p className="num text-sm text-night-600">
                {first}–{last} of {total}
              </p>
            }
          >
            <DataTable
              caption="Outgoing e-mail, newest first"
              columns={columns}
              rows={rows}
              rowKey={(m) => m.id}
              exportName="mailbox"
            />
            {pageCount > 1 ? (
              <nav aria-label="Pages" className="mt-4 flex items-center justify-between gap-3">
                {page > 1 ? (
                  <ButtonLink to={pageHref(q, page - 1)} variant="secondary" size="sm" rel="prev">
                    ← Newer
                  </ButtonLink>
                ) : (
                  <span />
                )}
                <p className="num text-sm text-night-600">
                  Page {page} of {pageCount}
                </p>
                {page < pageCount ? (
                  <ButtonLink to={pageHref(q, page + 1)} variant="secondary" size="sm" rel="next">
                    Older →
                  </ButtonLink>
                ) : (
                  <span />
                )}
              </nav>
            ) : null}
          </Card>
        )}
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
