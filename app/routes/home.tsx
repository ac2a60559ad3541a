import { Link, useRouteLoaderData } from "react-router";
import { Card } from "~/components/ui";
import { database } from "~/db/client.server";
import type { loader as rootLoader } from "~/root";
import { listSites, loadSiteRegistry } from "~/services/registry/queries.server";
import type { Route } from "./+types/home";

export async function loader(_: Route.LoaderArgs) {
  // Public page: no guard needed; it shows only the public array registry summary.
  const db = database();
  const [first] = await listSites(db);
  const registry = first ? await loadSiteRegistry(db, first.id) : null;
  return {
    array: registry
      ? {
          name: registry.site.name,
          latitudeDeg: registry.site.latitudeDeg,
          longitudeDeg: registry.site.longitudeDeg,
          altitudeM: registry.site.altitudeM,
          stations: registry.stations.length,
          configurations: registry.configurations.map((c) => ({ name: c.name, size: c.stationNames.length })),
          instruments: registry.instruments.map((i) => ({ name: i.name, bands: i.bands.map((b) => b.name) })),
        }
      : null,
  };
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

/** The viewer's own sections with a line each, or an invitation to sign in. */
function YourSections() {
  const root = useRouteLoaderData<typeof rootLoader>("root");
  if (!root) return null;
  if (!root.viewer) {
    return (
      <section
        aria-labelledby="start"
        className="rounded-[var(--radius-card)] bg-white p-5 shadow-[var(--shadow-card)] ring-1 ring-night-200"
      >
        <h2 id="start" className="text-lg font-semibold">
          Start here
        </h2>
        <p className="mt-1 text-night-700">
          <Link to="/sign-in" className="font-medium text-ember-700 underline underline-offset-2">
            Sign in
          </Link>{" "}
          with the observatory's single sign-on or an e-mail link to sketch coverage, keep a target list and write
          proposals. The{" "}
          <Link to="/registry" className="font-medium text-ember-700 underline underline-offset-2">
            array registry
          </Link>{" "}
          is open to everyone.
        </p>
      </section>
    );
  }
  return (
    <section aria-labelledby="yours">
      <h2 id="yours" className="text-xl font-semibold">
        Your sections, {root.viewer.name}
      </h2>
      <ul className="mt-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {root.sections.map((s) => (
          <li key={s.to}>
            <Link
              to={s.to}
              className="block h-full rounded-[var(--radius-card)] bg-white p-4 shadow-[var(--shadow-card)] ring-1 ring-night-200 hover:ring-ember-500"
            >
              <span className="font-semibold text-ember-800">{s.label}</span>
              <span className="mt-1 block text-sm text-night-700">{s.summary}</span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}

export default function Home({ loaderData }: Route.ComponentProps) {
  const { array } = loaderData;
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

      <section aria-labelledby="how">
        <h2 id="how" className="text-xl font-semibold">
          How a cycle runs here
        </h2>
        <ol className="mt-4 grid gap-4 md:grid-cols-3">
          {steps.map((s, i) => (
            <li
              key={s.title}
              className="rounded-[var(--radius-card)] bg-white p-5 shadow-[var(--shadow-card)] ring-1 ring-night-200"
            >
              <p className="num text-sm font-semibold text-ember-700">Step {i + 1}</p>
              <h3 className="mt-1 text-lg font-semibold">{s.title}</h3>
              <p className="mt-2 text-night-700">{s.text}</p>
            </li>
          ))}
        </ol>
      </section>

      <div className="grid gap-6 lg:grid-cols-2">
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

        <Card title="The array">
          {array ? (
            <div className="space-y-3 text-night-700">
              <p>
                <span className="font-semibold text-night-900">{array.name}</span> — latitude{" "}
                <span className="num">{array.latitudeDeg.toFixed(2)}°</span>, longitude{" "}
                <span className="num">{array.longitudeDeg.toFixed(2)}°</span>, altitude{" "}
                <span className="num">{array.altitudeM.toFixed(0)} m</span>;{" "}
                <span className="num">{array.stations}</span> stations.
              </p>
              <p>
                Configurations:{" "}
                {array.configurations.map((c, i) => (
                  <span key={c.name}>
                    {i > 0 ? ", " : ""}
                    <span className="font-medium text-night-900">{c.name}</span> ({c.size} stations)
                  </span>
                ))}
                .
              </p>
              <p>
                Instruments:{" "}
                {array.instruments.map((ins, i) => (
                  <span key={ins.name}>
                    {i > 0 ? "; " : ""}
                    <span className="font-medium text-night-900">{ins.name}</span> ({ins.bands.join(", ")} band
                    {ins.bands.length > 1 ? "s" : ""})
                  </span>
                ))}
                .
              </p>
              <Link
                to="/registry"
                className="inline-block font-medium text-ember-700 underline underline-offset-2 hover:text-ember-800"
              >
                Open the array registry
              </Link>
            </div>
          ) : (
            <p className="text-night-700">
              No array is registered yet. An administrator adds the site and its stations.
            </p>
          )}
        </Card>
      </div>
    </div>
  );
}
