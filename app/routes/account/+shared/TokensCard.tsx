import { Form, useNavigation } from "react-router";
import { Badge, Button, Card, TextField } from "~/components/ui";
import {
  DEFAULT_TOKEN_LIFETIME_DAYS,
  TOKEN_LIFETIMES_DAYS,
  TOKEN_SCOPE_LABELS,
  TOKEN_SCOPES,
  type TokenScope,
} from "~/lib/permissions";
import type { AccountToken } from "~/services/account/account.server";
import { TOKEN_NAME_MAX } from "~/services/account/schemas";
import type { TypedToken } from "./intents.server";

const scopeLabel = (s: string) => TOKEN_SCOPE_LABELS[s as TokenScope] ?? s;

/** The token just created, shown this once. */
function NewToken({ token }: { token: { name: string; token: string; scopes: string[]; expires: string } }) {
  return (
    <div role="status" className="mb-4 rounded-lg border border-ok-700/30 bg-ok-50 p-3 text-sm">
      <p className="font-semibold text-ok-700">New token “{token.name}” — copy it now, it will not be shown again:</p>
      <code data-testid="new-token" className="mt-1 block break-all rounded bg-white p-2 font-mono text-night-900">
        {token.token}
      </code>
      <p className="mt-2 text-night-700">
        It may: {token.scopes.map(scopeLabel).join("; ")}. It expires {token.expires}.
      </p>
    </div>
  );
}

function TokenState({ token: t }: { token: AccountToken }) {
  if (t.revokedAt) return <Badge tone="danger">revoked</Badge>;
  if (t.expired) return <Badge tone="caution">expired</Badge>;
  return <Badge tone="ok">active</Badge>;
}

function TokenLine({ token: t }: { token: AccountToken }) {
  return (
    <li className="flex flex-wrap items-center justify-between gap-3 py-2 text-sm">
      <div>
        <span className="font-medium">{t.name}</span> <code className="text-night-600">{t.prefix}…</code>{" "}
        <TokenState token={t} />
        <p className="text-night-600">
          created {t.created} · expires {t.expires} · last used {t.lastUsed}
        </p>
        <p className="text-night-600">may: {t.scopes.length ? t.scopes.map(scopeLabel).join("; ") : "nothing"}</p>
      </div>
      {t.revokedAt || t.expired ? null : (
        <Form method="post">
          <input type="hidden" name="intent" value="revoke-token" />
          <input type="hidden" name="tokenId" value={t.id} />
          <Button type="submit" variant="danger" size="sm" aria-label={`Revoke token ${t.name}`}>
            Revoke
          </Button>
        </Form>
      )}
    </li>
  );
}

/** What the new token may do: one checkbox per scope (running computations ticked at first). */
function ScopeChoices({ typed }: { typed: TypedToken | null }) {
  const ticked = (s: TokenScope) => (typed ? typed.scopes.includes(s) : s === "computations:read");
  return (
    <fieldset className="sm:col-span-2">
      <legend className="mb-1 text-sm font-medium text-night-900">The token may</legend>
      {TOKEN_SCOPES.map((s) => (
        <label key={s} className="flex items-center gap-2 py-0.5 text-sm text-night-800">
          <input type="checkbox" name="scopes" value={s} defaultChecked={ticked(s)} className="size-4" />
          {TOKEN_SCOPE_LABELS[s]}
        </label>
      ))}
    </fieldset>
  );
}

function LifetimeChoice({ typed }: { typed: TypedToken | null }) {
  return (
    <label className="block text-sm font-medium text-night-900">
      Expires after
      <select
        name="lifetimeDays"
        defaultValue={typed?.lifetimeDays || String(DEFAULT_TOKEN_LIFETIME_DAYS)}
        className="mt-1 block h-10 rounded-lg border border-night-300 bg-white px-3 text-night-900 focus-visible:outline-2 focus-visible:outline-ember-600"
      >
        {TOKEN_LIFETIMES_DAYS.map((d) => (
          <option key={d} value={d}>
            {d} days{d === DEFAULT_TOKEN_LIFETIME_DAYS ? " (default)" : ""}
          </option>
        ))}
      </select>
    </label>
  );
}

/** The person's API tokens: how scripts use them, a form for a new one, and each with its revoke button. */
export function TokensCard({
  tokens,
  newToken,
  typed,
}: {
  tokens: AccountToken[];
  newToken: { name: string; token: string; scopes: string[]; expires: string } | null;
  /** What was typed into the form of a token that was refused. */
  typed: TypedToken | null;
}) {
  const busy = useNavigation().state === "submitting";
  return (
    <Card title="API tokens">
      <p className="mb-3 text-sm text-night-700">
        Scripts call <code className="rounded bg-night-100 px-1">/api/*</code> with{" "}
        <code className="rounded bg-night-100 px-1">Authorization: Bearer &lt;token&gt;</code>. A token does only what
        you tick below, within your roles, and only through the API: it never opens this page, the People page or any
        other page. It expires after {DEFAULT_TOKEN_LIFETIME_DAYS} days unless you choose otherwise (at most{" "}
        {Math.max(...TOKEN_LIFETIMES_DAYS)}), and it is shown once.
      </p>
      {newToken ? <NewToken token={newToken} /> : null}
      <Form method="post" className="mb-4 grid gap-4 sm:grid-cols-[1fr_auto] sm:items-end">
        <input type="hidden" name="intent" value="create-token" />
        <TextField
          label="Token name"
          name="name"
          maxLength={TOKEN_NAME_MAX}
          defaultValue={typed?.name ?? ""}
          placeholder="e.g. coverage batch script"
          hint={`Up to ${TOKEN_NAME_MAX} characters.`}
        />
        <LifetimeChoice typed={typed} />
        <ScopeChoices typed={typed} />
        <div className="sm:col-span-2">
          <Button type="submit" disabled={busy}>
            Create token
          </Button>
        </div>
      </Form>
      {tokens.length === 0 ? (
        <p className="text-sm text-night-600">No tokens yet.</p>
      ) : (
        <ul className="divide-y divide-night-100">
          {tokens.map((t) => (
            <TokenLine key={t.id} token={t} />
          ))}
        </ul>
      )}
    </Card>
  );
}
