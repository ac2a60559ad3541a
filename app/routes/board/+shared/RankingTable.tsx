/**
 * The ranking: every proposal in the board's order with its scores (reviewers as R1, R2, … unless the
 * chair shows names), mean, spread, normalized score, rank, disagreement, grade and suggestion; sortable,
 * filterable, exported as CSV with units.
 */

import { useMemo, useState } from "react";
import { href, Link } from "react-router";
import { Badge, Card, type Column, DataTable, SelectField, TextField } from "~/components/ui";
import { plural } from "~/lib/format";
import type { BoardPageData } from "~/services/committee/board-page.server";

type Row = BoardPageData["rows"][number];

const fmt = (x: number | null, d = 2) => (x === null ? null : Number(x.toFixed(d)));
const DECISION_WORDS = { accept: "accept", waitlist: "waiting list", decline: "decline" } as const;

export function RankingTable({
  rows,
  reviewers,
  scaleText,
  triageAfter,
  cycleName,
}: {
  rows: Row[];
  reviewers: { label: string; name: string }[];
  scaleText: string;
  triageAfter: number | null;
  cycleName: string;
}) {
  const [query, setQuery] = useState("");
  const [category, setCategory] = useState("");
  const [configuration, setConfiguration] = useState("");
  const [disagreementOnly, setDisagreementOnly] = useState(false);
  const [aboveOnly, setAboveOnly] = useState(false);
  const [names, setNames] = useState(false);
  const nameOf = useMemo(() => new Map(reviewers.map((r) => [r.label, r.name])), [reviewers]);
  const categories = [...new Set(rows.map((r) => r.category))].sort();
  const configurations = [...new Set(rows.flatMap((r) => r.configurations))].sort();

  const shown = rows.filter(
    (r) =>
      (query === "" || `${r.title} ${r.pi}`.toLowerCase().includes(query.toLowerCase())) &&
      (category === "" || r.category === category) &&
      (configuration === "" || r.configurations.includes(configuration)) &&
      (!disagreementOnly || r.disagreement) &&
      (!aboveOnly || !r.belowTriage),
  );
  const who = (label: string) => (names ? (nameOf.get(label) ?? label) : label);

  const columns: Column<Row>[] = [
    {
      key: "position",
      header: "#",
      align: "right",
      value: (r) => r.position,
      render: (r) => (
        <span className="inline-flex items-center gap-1">
          {r.position}
          {r.belowTriage ? <Badge tone="neutral">below line</Badge> : null}
        </span>
      ),
    },
    {
      key: "title",
      header: "Proposal",
      value: (r) => r.title,
      render: (r) => (
        <Link
          className="block min-w-52 font-medium text-ember-800 underline"
          to={href("/review/proposals/:proposalId", { proposalId: String(r.proposalId) })}
        >
          {r.title}
        </Link>
      ),
    },
    { key: "pi", header: "PI", value: (r) => r.pi },
    { key: "category", header: "Category", value: (r) => r.category },
    { key: "configurations", header: "Configurations", value: (r) => r.configurations.join(", ") },
    { key: "hours", header: "Requested", unit: "h", align: "right", value: (r) => r.hoursRequested },
    {
      key: "scores",
      header: "Scores",
      value: (r) => r.scores.map((s) => `${who(s.label)}: ${s.score}`).join("; ") || null,
      render: (r) =>
        r.scores.length ? (
          <span className="num whitespace-nowrap">{r.scores.map((s) => `${who(s.label)} ${s.score}`).join(" · ")}</span>
        ) : (
          <span className="text-night-500">
            {r.submitted}/{r.assigned} in
          </span>
        ),
    },
    { key: "mean", header: "Mean", unit: "score", align: "right", value: (r) => fmt(r.meanScore) },
    { key: "spread", header: "Spread", unit: "score SD", align: "right", value: (r) => fmt(r.spread) },
    { key: "normalized", header: "Normalized", unit: "z", align: "right", value: (r) => fmt(r.normalizedScore, 3) },
    { key: "rank", header: "Rank", align: "right", value: (r) => r.rank },
    {
      key: "disagreement",
      header: "Disagreement",
      value: (r) => (r.disagreement ? "yes" : "no"),
      render: (r) => (r.disagreement ? <Badge tone="caution">⚑ disagree</Badge> : null),
    },
    { key: "grade", header: "Final grade", align: "right", value: (r) => r.finalGrade },
    {
      key: "suggestion",
      header: "Suggestion",
      value: (r) => `${r.suggestion.decision}: ${r.suggestion.reason}`,
      render: (r) => (
        <span className="text-night-700">
          <span className="font-medium">{DECISION_WORDS[r.suggestion.decision]}</span> — {r.suggestion.reason}
        </span>
      ),
    },
    {
      key: "decision",
      header: "Decision",
      value: (r) => (r.decision.decision ? `${r.decision.decision}${r.releasedAt ? " (sent)" : ""}` : null),
    },
  ];

  return (
    <Card title="Ranking">
      <p className="mb-3 text-sm text-night-700">
        Order: final grades first (best first), then the normalized score — each review's z-score against its reviewer's
        own mean and spread, as <code>cli rank</code> computes it — then the mean. Scale {scaleText}.{" "}
        {triageAfter === null ? "No triage line placed." : `Triage line after position ${triageAfter}.`}
      </p>
      <search className="mb-3 grid gap-3 sm:grid-cols-2 lg:grid-cols-4" aria-label="Filter the ranking">
        <TextField label="Title or PI" value={query} onChange={(e) => setQuery(e.target.value)} />
        <SelectField label="Category" value={category} onChange={(e) => setCategory(e.target.value)}>
          <option value="">All categories</option>
          {categories.map((c) => (
            <option key={c}>{c}</option>
          ))}
        </SelectField>
        <SelectField label="Configuration" value={configuration} onChange={(e) => setConfiguration(e.target.value)}>
          <option value="">All configurations</option>
          {configurations.map((c) => (
            <option key={c}>{c}</option>
          ))}
        </SelectField>
        <div className="grid content-end gap-1 text-sm">
          {(
            [
              ["Disagreements only", disagreementOnly, setDisagreementOnly],
              ["Above the triage line only", aboveOnly, setAboveOnly],
              ["Show reviewer names (chair only)", names, setNames],
            ] as const
          ).map(([text, checked, setChecked]) => (
            <label key={text} className="flex items-center gap-2">
              <input
                type="checkbox"
                checked={checked}
                onChange={(e) => setChecked(e.target.checked)}
                className="h-4 w-4 accent-ember-700"
              />
              {text}
            </label>
          ))}
        </div>
      </search>
      <p className="mb-2 text-sm text-night-600" aria-live="polite">
        {shown.length} of {plural(rows.length, "proposal")} shown.
      </p>
      <DataTable
        columns={columns}
        rows={shown}
        rowKey={(r) => r.proposalId}
        caption={`Ranking board of ${cycleName}`}
        exportName={`ranking-${cycleName}`}
        empty="No proposal matches the filters."
      />
    </Card>
  );
}
