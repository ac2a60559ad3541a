/** The PI and the co-investigators; the PI adds and removes co-investigators. */
import { Form } from "react-router";
import { Badge, Button, Card, TextField } from "~/components/ui";
import { RemoveButton } from "./IntentButton";
import type { ActionResult } from "./result";

export type TeamCardProps = {
  pi: { name: string; email: string };
  members: { id: number; email: string; name: string | null }[];
  /** The viewer may change the team (the PI, on an editable draft). */
  manage: boolean;
  /** Say that only the PI changes the team (a co-investigator who may edit). */
  piOnlyNote: boolean;
  result?: ActionResult;
};

export function TeamCard({ pi, members, manage, piOnlyNote, result }: TeamCardProps) {
  return (
    <Card title="Team">
      <ul className="grid gap-2 text-sm">
        <li className="flex items-center gap-2">
          <Badge tone="accent">PI</Badge>
          <span className="font-medium">{pi.name}</span>
          <span className="text-night-600">{pi.email}</span>
        </li>
        {members.map((m) => (
          <li key={m.id} className="flex items-start gap-2">
            <Badge>Co-I</Badge>
            <span className="min-w-0 flex-1">
              <span className="font-medium">{m.name ?? "(no account yet)"}</span>{" "}
              <span className="break-all text-night-600">{m.email}</span>
            </span>
            {manage ? <RemoveButton intent="remove-member" fields={{ memberId: m.id }} what={m.email} /> : null}
          </li>
        ))}
      </ul>
      {manage ? (
        <Form
          // A new team remounts the form: the address just added is cleared; a refused one stays typed.
          key={members.map((m) => m.id).join(",")}
          method="post"
          className="mt-4 flex flex-wrap items-end gap-3"
          noValidate
          aria-label="Add a co-investigator"
        >
          <input type="hidden" name="intent" value="add-member" />
          <div className="min-w-56 flex-1">
            <TextField
              label="Co-investigator e-mail"
              name="email"
              type="email"
              defaultValue={result?.values?.email ?? ""}
              error={result?.errors.email}
              autoComplete="off"
            />
          </div>
          <Button type="submit" variant="secondary">
            Add
          </Button>
        </Form>
      ) : (
        <p className="mt-3 text-sm text-night-600">{piOnlyNote ? "Only the PI changes the team." : null}</p>
      )}
    </Card>
  );
}
