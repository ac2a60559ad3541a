import { Text } from "@react-email/components";
import type { Verdict } from "~/services/proposals/feasibility";
import { EmailLayout, emailStyles } from "./EmailLayout";
import { ProposalButton } from "./ProposalButton";

export type ProposalSubmittedEmailProps = {
  name: string | null;
  title: string;
  cycleName: string;
  version: number;
  submittedBy: string;
  /** e.g. "2026-12-01 17:20 UTC" */
  submittedAt: string;
  deadline: string;
  targets: number;
  hours: number;
  verdict: Verdict;
  documentSha256: string;
  url: string;
};

const VERDICT_WORDS: Record<Verdict, string> = {
  pass: "every check passed",
  caution: "some lines ask for care",
  fail: "some lines failed — the committee will see why",
};

/** The notice at submission, to the PI and every co-investigator. */
export function ProposalSubmittedEmail(p: ProposalSubmittedEmailProps) {
  return (
    <EmailLayout preview={`“${p.title}” was submitted to ${p.cycleName} (version ${p.version}).`}>
      <Text style={emailStyles.heading}>{p.name ? `Hello ${p.name},` : "Hello,"}</Text>
      <Text style={emailStyles.paragraph}>
        {p.submittedBy} submitted <strong>“{p.title}”</strong> to the {p.cycleName} cycle on {p.submittedAt}. This is
        version {p.version}; it is frozen as it is now and is what the committee will read.
      </Text>
      <ul style={emailStyles.list}>
        <li>
          {p.targets} target{p.targets === 1 ? "" : "s"}, {p.hours.toFixed(1)} h requested
        </li>
        <li>Feasibility report: {VERDICT_WORDS[p.verdict]}</li>
        {p.documentSha256 ? <li>Science case PDF, SHA-256 {p.documentSha256.slice(0, 16)}…</li> : null}
      </ul>
      <Text style={emailStyles.paragraph}>
        To change anything, the PI can withdraw the proposal and reopen it as a draft before the deadline ({p.deadline}
        ), then submit it again.
      </Text>
      <ProposalButton url={p.url} />
      <Text style={emailStyles.small}>You receive this because you are on the proposal's team.</Text>
    </EmailLayout>
  );
}
