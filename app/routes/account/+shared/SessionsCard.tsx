import { Form } from "react-router";
import { Badge, Button, Card, IntentButton } from "~/components/ui";
import type { AccountSession } from "~/services/account/account.server";

/** Where the person is signed in; every session but this browser's can be signed out from here. */
export function SessionsCard({
  sessions,
  currentSessionId,
}: {
  sessions: AccountSession[];
  currentSessionId: string | null;
}) {
  const signOutOthers =
    sessions.length > 1 ? (
      <Form method="post">
        <input type="hidden" name="intent" value="revoke-other-sessions" />
        <Button type="submit" variant="secondary" size="sm">
          Sign out everywhere else
        </Button>
      </Form>
    ) : null;
  return (
    <Card title="Where you are signed in" actions={signOutOthers}>
      <ul className="divide-y divide-night-100">
        {sessions.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
            <div className="text-sm">
              <p className="font-medium text-night-900">
                {s.userAgent ? s.userAgent.slice(0, 80) : "Unknown browser"}{" "}
                {s.id === currentSessionId ? <Badge tone="ok">this browser</Badge> : null}
              </p>
              <p className="text-night-600">
                via {s.method === "sso" ? "single sign-on" : "e-mail link"}
                {s.address ? ` from ${s.address}` : ""} · started {s.started} · last used {s.lastUsed} · expires{" "}
                {s.expires}
              </p>
            </div>
            {s.id !== currentSessionId ? (
              <IntentButton
                intent="revoke-session"
                hidden={{ sessionId: s.id }}
                label={`Sign out the session started ${s.started}`}
              >
                Sign out
              </IntentButton>
            ) : null}
          </li>
        ))}
      </ul>
    </Card>
  );
}
