import { Card, cardClass } from "~/components/ui";
import { dbContext } from "~/context";
import { arraySummary } from "~/services/home/summary.server";
import { ArrayCard } from "./+shared/ArrayCard";
import { YourSections } from "./+shared/YourSections";
import type { Route } from "./+types/index";

export async function loader({ context }: Route.LoaderArgs) {
  // Public page: no guard needed; it shows only the public array registry summary.
  return { array: await arraySummary(context.get(dbContext)) };
}

export const meta: Route.MetaFunction = () => [
  { title: "Fringe Docket — the observing cycle of an interferometric array" },
];

const steps = [
  {
    title: "Propose",
    text: "Sketch the uv coverage a configuration gives your target, model the source, pick station triangles with useful closure phases, and submit a proposal whose feasibility is checked for you.",
  },
  {
    title: "Review",
    text: "Committee members declare conflicts, read each proposal with the same plots and feasibility report the team saw, and score it. The chair ranks, weighs demand against the nights each configuration has, and sends decisions.",
  },
  {
    title: "Observe",
    text: "Operations turns accepted programs into night plans: calibrator and science blocks in time order, within twilight, elevation and delay-line limits, exported and published to the teams.",
  },
];

const roles = [
  { role: "Proposers", text: "sketch coverage, model targets, write and submit proposals, read decisions." },
  { role: "Reviewers", text: "read assigned proposals, declare conflicts, score and comment." },
  {
    role: "The chair",
    text: "runs the cycle: dates, nights per configuration, reviewers, ranking, allocation, decisions.",
  },
  { role: "Schedulers", text: "build, export and publish night plans from accepted programs." },
  { role: "Administrators", text: "manage accounts and roles and keep the array registry up to date." },
];

function HowACycleRuns() {
  return (
    <section aria-labelledby="how">
      <h2 id="how" className="text-xl font-semibold">
        How a cycle runs here
      </h2>
      <ol className="mt-4 grid gap-4 md:grid-cols-3">
        {steps.map((s, i) => (
          <li key={s.title} className={cardClass("p-5")}>
            <p className="num text-sm font-semibold text-ember-700">Step {i + 1}</p>
            <h3 className="mt-1 text-lg font-semibold">{s.title}</h3>
            <p className="mt-2 text-night-700">{s.text}</p>
          </li>
        ))}
      </ol>
    </section>
  );
}

function WhoDoesWhat() {
  return (
    <Card title="Who does what">
      <ul className="space-y-2 text-night-700">
        {roles.map((r) => (
          <li key={r.role}>
            <span className="font-semibold text-night-900">{r.role}</span> {r.text}
          </li>
        ))}
      </ul>
      <p className="mt-3 text-sm text-night-600">
        One person may hold several roles; nobody reviews a proposal they are on or conflicted with.
      </p>
    </Card>
  );
}

export default function Home({ loaderData }: Route.ComponentProps) {
  return (
    <div className="space-y-10">
      <section className="rounded-2xl bg-night-900 px-6 py-10 text-white sm:px-10">
        <p className="text-sm font-semibold tracking-widest text-ember-300">ONE CYCLE, ONE PLACE</p>
        <h1 className="mt-2 max-w-3xl text-3xl font-semibold text-white sm:text-4xl">
          From the first uv sketch to the night plan.
        </h1>
        <p className="mt-4 max-w-3xl text-night-100">
          Fringe Docket runs the observing cycle of an optical/infrared interferometric array. Astronomers check that a
          configuration on offer samples the spatial frequencies their science needs and write proposals; the
          time-allocation committee reviews, scores and ranks them against the nights available; operations turns the
          accepted programs into night plans.
        </p>
      </section>
      <YourSections />
      <HowACycleRuns />
      <div className="grid gap-6 lg:grid-cols-2">
        <WhoDoesWhat />
        <ArrayCard array={loaderData.array} />
      </div>
    </div>
  );
}
