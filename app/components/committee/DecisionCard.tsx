/**
 * The committee's decision on the proposer's page: the outcome, the hours granted per configuration,
 * the chair's message and the reviewers' comments to the PI (without names). Its data comes from
 * `decisionForTeam` (services/committee/outcomes.server.ts); nothing is shown before the release.
 */
import { Badge, type BadgeTone, Card } from "~/components/ui";
import type { TeamDecision } from "~/services/committee/outcomes.server";

const TONE: Record<TeamDecision["decision"], BadgeTone> = { accept: "ok", waitlist: "caution", decline: "danger" };
const MARK: Record<TeamDecision["decision"], string> = { accept: "✓", waitlist: "…", decline: "✕" };

export function DecisionCard({ decision }: { decision: TeamDecision | null }) {
  if (!decision) return null;
  const d = decision;
  return (
    <Card title="The committee's decision">
      <p className="flex flex-wrap items-center gap-2">
        <Badge tone={TONE[d.decision]}>
          <span aria-hidden="true" className="mr-1 font-semibold">
            {MARK[d.decision]}
          </span>
          {d.words}
        </Badge>
        <span className="text-sm text-night-700">
          Cycle {d.cycleName}, sent {d.releasedAt.slice(0, 16).replace("T", " ")} UTC
        </span>
      </p>
      {d.decision === "accept" ? (
        <div className="mt-3">
          <p className="text-sm font-medium text-night-800">
            Time granted: <span className="num">{d.totalHours.toFixed(1)} h</span>
          </p>
          <ul className="num mt-1 grid gap-0.5 text-sm">
            {d.hours.map((h) => (
              <li key={h.configuration}>
                {h.configuration}: {h.hours.toFixed(1)} h
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {d.message ? (
        <div className="mt-3">
          <p className="text-sm font-medium text-night-800">From the chair</p>
          <p className="whitespace-pre-wrap text-sm text-night-900">{d.message}</p>
        </div>
      ) : null}
      {d.comments.length ? (
        <div className="mt-3">
          <p className="text-sm font-medium text-night-800">The reviewers' comments to you</p>
          <ul className="mt-1 grid gap-2 text-sm">
            {d.comments.map((c) => (
              <li key={c.label}>
                <span className="font-medium">{c.label}:</span> <span className="whitespace-pre-wrap">{c.text}</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </Card>
  );
}
