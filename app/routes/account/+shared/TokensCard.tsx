import { Form, useNavigation } from "react-router";
import { Badge, Button, Card, TextField } from "~/components/ui";
import type { AccountToken } from "~/services/account/account.server";

/** The token just created, shown this once. */
function NewToken({ name, token }: { name: string; token: string }) {
  return (
    <div role="status" className="mb-4 rounded-lg border border-ok-700/30 bg-ok-50 p-3 text-sm">
      <p className="font-semibold text-ok-700">New token “{name}” — copy it now, it will not be shown again:</p>
      <code data-testid="new-token" className="mt-1 block break-all rounded bg-white p-2 font-mono text-night-900">
        {token}
      </code>
    </div>
  );
}

function TokenLine({ token: t }: { token: AccountToken }) {
  return (
    <li className="flex flex-wrap items-center justify-between gap-3 py-2 text-sm">
      <div>
        <span className="font-medium">{t.name}</span> <code className="text-night-600">{t.prefix}…</code>{" "}
        {t.revokedAt ? <Badge tone="danger">revoked</Badge> : <Badge tone="ok">active</Badge>}
        <p className="text-night-600">
          created {t.created} · last used {t.lastUsed}
        </p>
      </div>
      {t.revokedAt ? null : (
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

/** The person's API tokens: how scripts use them, a form for a new one, and each with its revoke button. */
export function TokensCard({
  tokens,
  newToken,
  tokenName,
}: {
  tokens: AccountToken[];
  newToken: { name: string; token: string } | null;
  /** What was typed as the name of a token that was refused. */
  tokenName: string;
}) {
  const busy = useNavigation().state === "submitting";
  return (
    <Card title="API tokens">
      <p className="mb-3 text-sm text-night-700">
        Scripts call <code className="rounded bg-night-100 px-1">/api/*</code> with{" "}
        <code className="rounded bg-night-100 px-1">Authorization: Bearer &lt;token&gt;</code>. A token acts with your
        roles; it is shown once.
      </p>
      {newToken ? <NewToken name={newToken.name} token={newToken.token} /> : null}
      <Form method="post" className="mb-4 flex flex-wrap items-end gap-3">
        <input type="hidden" name="intent" value="create-token" />
        <div className="min-w-60 flex-1">
          <TextField
            label="Token name"
            name="name"
            maxLength={80}
            defaultValue={tokenName}
            placeholder="e.g. coverage batch script"
          />
        </div>
        <Button type="submit" disabled={busy}>
          Create token
        </Button>
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
