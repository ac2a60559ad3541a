/** The versions submitted so far, each with its page and its frozen PDF. */
import { href, Link } from "react-router";
import { Card } from "~/components/ui";
import { shownUtc } from "../utc";

export type VersionsCardProps = {
  proposalId: number;
  versions: {
    version: number;
    submittedAt: string;
    submittedBy: string | null;
    documentSha256: string | null;
    /** "Submitted with 2 feasibility warnings acknowledged by …", when the version needed it. */
    acknowledged: string | null;
  }[];
};

export function VersionsCard({ proposalId, versions }: VersionsCardProps) {
  if (versions.length === 0) return null;
  const id = String(proposalId);
  return (
    <Card title="Submitted versions">
      <ul className="grid gap-2 text-sm">
        {versions.map((x) => (
          <li key={x.version} className="flex flex-wrap items-center gap-2">
            <Link
              to={href("/proposals/:proposalId/versions/:version", { proposalId: id, version: String(x.version) })}
              className="font-medium text-ember-800 underline"
            >
              Version {x.version}
            </Link>
            <span className="text-night-600">
              {shownUtc(x.submittedAt)}
              {x.submittedBy ? ` by ${x.submittedBy}` : ""}
            </span>
            {x.documentSha256 ? (
              <a
                href={`${href("/proposals/:proposalId/science-case", { proposalId: id })}?version=${x.version}`}
                className="ml-auto text-ember-800 underline"
                download
              >
                PDF
              </a>
            ) : null}
            {x.acknowledged ? <span className="basis-full text-caution-700">{x.acknowledged}</span> : null}
          </li>
        ))}
      </ul>
    </Card>
  );
}
