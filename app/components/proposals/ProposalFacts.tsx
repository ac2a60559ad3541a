/** A proposal's text as it stands, read-only: science category, instrument and band, abstract. */
import type { ReactNode } from "react";
import { Card } from "~/components/ui";

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
