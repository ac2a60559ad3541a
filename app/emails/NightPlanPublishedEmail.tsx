import { Link, Text } from "@react-email/components";
import { EmailButton, EmailGreeting, EmailLayout, emailStyles } from "./EmailLayout";

export type NightPlanEmailBlock = {
  kind: "calibrator" | "science";
  target: string;
  object: string;
  /** "00:14:40 UTC" */
  startUt: string;
  endUt: string;
  /** "7h 12m" */
  startLst: string;
};

export type NightPlanPublishedEmailProps = {
  name: string | null;
  date: string;
  configuration: string;
  programTitle: string;
  blocks: NightPlanEmailBlock[];
  /** Science hours of the program in this plan. */
  scienceHours: number;
  proposalUrl: string;
  icsUrl: string;
  caution: string;
};

/** The notice at publication of a night plan, to the PI and co-investigators of each program in it. */
export function NightPlanPublishedEmail(p: NightPlanPublishedEmailProps) {
  return (
    <EmailLayout preview={`The night of ${p.date} is planned: ${p.blocks.length} blocks for “${p.programTitle}”.`}>
      <EmailGreeting name={p.name} />
      <Text style={emailStyles.paragraph}>
        The plan of the night of <strong>{p.date}</strong> (configuration {p.configuration}) is published. It holds{" "}
        {p.blocks.length} block{p.blocks.length === 1 ? "" : "s"} for <strong>“{p.programTitle}”</strong>, with{" "}
        {p.scienceHours.toFixed(2)} h of science time. Times are UTC; LST is the local mean sidereal time at the start.
      </Text>
      <ul style={emailStyles.list}>
        {p.blocks.map((b) => (
          <li key={`${b.startUt}-${b.object}`}>
            {b.startUt.replace(" UTC", "")} – {b.endUt} ·{" "}
            {b.kind === "science" ? `Science: ${b.target}` : `Calibrator ${b.object} for ${b.target}`} · LST{" "}
            {b.startLst}
          </li>
        ))}
      </ul>
      <Text style={emailStyles.paragraph}>
        Add the blocks to your calendar:{" "}
        <Link href={p.icsUrl} style={emailStyles.link}>
          the night's iCalendar file
        </Link>{" "}
        (your program's blocks, one event each).
      </Text>
      <EmailButton href={p.proposalUrl}>See your program</EmailButton>
      <Text style={emailStyles.small}>{p.caution}</Text>
      <Text style={emailStyles.small}>You receive this because you are on the program's team.</Text>
    </EmailLayout>
  );
}
