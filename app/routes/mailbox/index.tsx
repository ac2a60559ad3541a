import { data, Form, href, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import {
  Badge,
  Button,
  ButtonLink,
  Card,
  type Column,
  DataTable,
  EmptyState,
  PageHeader,
  TextField,
} from "~/components/ui";
import { dbContext } from "~/context";
import { requireMailboxReader } from "~/lib/guards.server";
import { MAILBOX_QUERY_MAX } from "~/services/mailbox/limits";
import { mailboxOverview, parseMailboxQuery } from "~/services/mailbox/queries.server";
import { Pager } from "./+shared/Pager";
import { attemptsText, Recipient, StatusBadge } from "./+shared/parts";
import type { Route } from "./+types/index";

export async function loader({ request, url, context }: Route.LoaderArgs) {
  const viewer = await requireMailboxReader(request);
  const query = parseMailboxQuery(url.searchParams);
  const reader = { email: viewer.user.email, readsAll: viewer.readsAll };
  const overview = await mailboxOverview(context.get(dbContext), { query, reader });
  return data(overview, { status: query.qTooLong ? 400 : 200 });
}

export const meta: Route.MetaFunction = () => [{ title: "Mailbox — Fringe Docket" }];

type Row = Route.ComponentProps["loaderData"]["rows"][number];

function StatusCell({ row }: { row: Row }) {
  if (row.status !== "retrying") return <StatusBadge status={row.status} />;
  return (
    <div className="space-y-1">
      <StatusBadge status="retrying">queued · retrying · {attemptsText(row.attempts)}</StatusBadge>
      <p className="text-xs text-night-600">next {row.nextAttempt}</p>
      {row.lastError ? (
        <p className="max-w-xs truncate text-xs text-danger-700" title={row.lastError}>
          {row.lastError}
        </p>
      ) : null}
    </div>
  );
}

function SubjectLink({ row }: { row: Row }) {
  return (
    <Link
      to={href("/mailbox/:messageId", { messageId: String(row.id) })}
      className="font-medium text-ember-700 underline-offset-2 hover:underline"
    >
      {row.subject}
    </Link>
  );
}

const columns: Column<Row>[] = [
  {
    key: "created",
    header: "Created",
    value: (m) => m.createdAt,
    render: (m) => <span className="num whitespace-nowrap">{m.created}</span>,
  },
  { key: "to", header: "To", value: (m) => m.to, render: (m) => <Recipient to={m.to} toViewer={m.toViewer} /> },
  { key: "subject", header: "Subject", value: (m) => m.subject, render: (m) => <SubjectLink row={m} /> },
  { key: "kind", header: "Kind", value: (m) => m.kind, render: (m) => <Badge>{m.kind}</Badge> },
  {
    key: "status",
    header: "Status",
    value: (m) => (m.status === "retrying" ? `queued, retrying (${m.attempts})` : m.status),
    render: (m) => <StatusCell row={m} />,
  },
];

/** The list's address for a search and a page (page 1 and no search leave their parameter out). */
function pageHref(q: string, page: number) {
  const params = new URLSearchParams();
  if (q) params.set("q", q);
  if (page > 1) params.set("page", String(page));
  const search = params.toString();
  return search ? `${href("/mailbox")}?${search}` : href("/mailbox");
}

function NoMessages({ q }: { q: string }) {
  return q ? (
    <EmptyState title={`No message matches “${q}”`}>
      Try part of an address, or another word from the subject.
    </EmptyState>
  ) : (
    <EmptyState title="No messages yet">
      Notices show up here as soon as the app writes them: a change of roles, a submission, a decision.
    </EmptyState>
  );
}

export default function Mailbox({ loaderData }: Route.ComponentProps) {
  const { q, page, pageCount, pageSize, total, rows, readsAll, qTooLong } = loaderData;
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <>
      <PageHeader
        title="Mailbox"
        lead={
          readsAll
            ? "Every e-mail Fringe Docket has written, newest first: delivered, queued, or queued and retrying while the mail server does not answer. One-time sign-in links that are still valid are hidden from everyone but their recipient."
            : "The e-mails Fringe Docket has written to you, newest first: delivered, queued, or queued and retrying while the mail server does not answer."
        }
      />
      <div className="grid grid-cols-1 gap-6">
        <Form method="get" action={href("/mailbox")} role="search" className="flex flex-wrap items-end gap-3">
          <div className="min-w-64 flex-1">
            <TextField
              label="Search by address or subject"
              name="q"
              type="search"
              defaultValue={q}
              maxLength={MAILBOX_QUERY_MAX}
              hint={`Up to ${MAILBOX_QUERY_MAX} characters.`}
              error={
                qTooLong
                  ? `The search text is longer than ${MAILBOX_QUERY_MAX} characters; nothing was searched.`
                  : undefined
              }
            />
          </div>
          <Button type="submit">Search</Button>
          {q ? (
            <ButtonLink to={href("/mailbox")} variant="secondary">
              Show all
            </ButtonLink>
          ) : null}
        </Form>

        {total === 0 ? (
          <NoMessages q={q} />
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
              caption={readsAll ? "Outgoing e-mail, newest first" : "Your e-mail, newest first"}
              columns={columns}
              rows={rows}
              exportName="mailbox"
            />
            {pageCount > 1 ? <Pager page={page} pageCount={pageCount} hrefFor={(n) => pageHref(q, n)} /> : null}
          </Card>
        )}
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
