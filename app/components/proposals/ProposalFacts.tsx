/** A proposal's text as it stands, read-only: science category, instrument and band, abstract. */
import type { ReactNode } from "react";
import { Badge, Card } from "~/components/ui";

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-night-600">{term}</dt>
      {children}
    </div>
  );
}

export function ProposalFacts({
  category,
  band,
  abstract,
  abstractTerm = "Abstract",
}: {
  category: string;
  band: string | null;
  abstract: string;
  abstractTerm?: string;
}) {
  return (
    <Card title="Proposal">
      <dl className="grid gap-3 text-sm">
        <Fact term="Science category">
          <dd className="font-medium">{category || "—"}</dd>
        </Fact>
        <Fact term="Instrument and band">
          <dd className="font-medium">{band ?? "—"}</dd>
        </Fact>
        <Fact term={abstractTerm}>
          <dd className="whitespace-pre-wrap text-night-900">{abstract || "—"}</dd>
        </Fact>
      </dl>
    </Card>
  );
}

/** A member of the team as a frozen version shows them: name and a line that tells them apart. */
export type TeamMember = { name: string; detail: string };

/** The team of a proposal, PI first. */
export function TeamFacts({ pi, coInvestigators }: { pi: TeamMember | null; coInvestigators: TeamMember[] }) {
  return (
    <Card title="Team">
      <ul className="grid gap-1 text-sm">
        {pi ? (
          <li>
            <Badge tone="accent">PI</Badge> {pi.name} <span className="text-night-600">{pi.detail}</span>
          </li>
        ) : null}
        {coInvestigators.map((c) => (
          <li key={`${c.name} ${c.detail}`}>
            <Badge>Co-I</Badge> {c.name} <span className="text-night-600">{c.detail}</span>
          </li>
        ))}
      </ul>
    </Card>
  );
}

/** The hours requested per configuration; `children` follow the list (the science case's link). */
export function HoursFacts({
  hours,
  children,
}: {
  hours: { configurationId: number; configuration: string; hours: number }[];
  children?: ReactNode;
}) {
  return (
    <Card title="Requested hours">
      <ul className="num grid gap-1 text-sm">
        {hours.map((h) => (
          <li key={h.configurationId}>
            {h.configuration}: {h.hours} h
          </li>
        ))}
      </ul>
      {children}
    </Card>
  );
}
