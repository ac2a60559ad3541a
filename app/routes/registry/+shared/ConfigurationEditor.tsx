/** The configuration editor, one component for the new and the edit page: the station list beside the site plan. */
import { useState } from "react";
import { TextField } from "~/components/ui";
import { sentence } from "~/lib/form-errors";
import type { Route as EditRoute } from "../configurations/+types/edit";
import type { Route as NewRoute } from "../configurations/+types/new";
import * as Editor from "./EditorPage";
import { CONFIGURATION_FIELDS } from "./fields";
import { overviewHref } from "./links";
import { type MapStation, StationMap } from "./StationMap";

export const newConfigurationMeta = () => Editor.meta("New configuration");
export const editConfigurationMeta = ({ data }: EditRoute.MetaArgs) =>
  Editor.meta(`Edit ${data?.configuration.name ?? "configuration"}`);

const splitNames = (list: string) => list.split(/[\s,;]+/).filter(Boolean);

/** How many stations and baselines the list makes, and what is off about it. */
function ListFigures({ names, stations, widest }: { names: string[]; stations: MapStation[]; widest: number }) {
  const known = new Set(stations.map((s) => s.name));
  const unknown = names.filter((n) => !known.has(n));
  return (
    <p className="text-sm text-night-700" aria-live="polite">
      {names.length} station{names.length === 1 ? "" : "s"}, {(names.length * (names.length - 1)) / 2} baselines
      {unknown.length > 0 ? (
        <span className="block font-medium text-danger-700">Not at this site: {unknown.join(", ")}</span>
      ) : null}
      {widest > 0 && names.length > widest ? (
        <span className="block font-medium text-caution-700">
          No instrument combines more than {widest} telescopes; this list has {names.length}. It can still be saved.
        </span>
      ) : null}
    </p>
  );
}

function ConfigurationFields({
  state,
  defaults,
  stations,
  widest,
}: {
  state: Editor.FormState;
  defaults: Editor.Defaults;
  stations: MapStation[];
  /** Most telescopes any instrument combines (0 when there are no instruments). */
  widest: number;
}) {
  const [list, setList] = useState(state?.values?.stations ?? defaults.stations ?? "");
  const names = splitNames(list);
  // Start framed on the stations the configuration has (the whole site for a new one).
  const [framing] = useState(() => {
    const first = new Set(names);
    const points = stations.filter((s) => first.has(s.name));
    return points.length > 0 ? points : null;
  });
  const offeredDefault = (state?.values ? state.values.offered : defaults.offered) === "on";
  const stationsError = state?.errors?.stations;
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
      <div className="grid content-start gap-4">
        <Editor.FieldList specs={CONFIGURATION_FIELDS.slice(0, 2)} state={state} defaults={defaults} />
        <label className="inline-flex items-center gap-2 text-sm font-medium text-night-800">
          <input type="checkbox" name="offered" defaultChecked={offeredDefault} className="h-4 w-4 accent-ember-700" />
          Offered to proposers
        </label>
        <TextField
          label={CONFIGURATION_FIELDS[3].label}
          name="stations"
          required
          autoComplete="off"
          value={list}
          onChange={(e) => setList(e.target.value)}
          error={stationsError ? sentence(stationsError) : undefined}
          hint="Names separated by spaces or commas; at least 2. Click stations on the map to add them. Baseline i–j is station j minus station i in this order."
        />
        <ListFigures names={names} stations={stations} widest={widest} />
      </div>
      <StationMap
        stations={stations}
        draft={{ name: "This configuration", stationNames: names }}
        frame={framing}
        height={420}
        label="Site plan with the configuration's stations and baselines"
        onPickStation={(name) =>
          setList((cur) => (splitNames(cur).includes(name) ? cur : `${cur.trim()} ${name}`.trim()))
        }
      />
    </div>
  );
}

type Props = Editor.Props<NewRoute.ComponentProps, EditRoute.ComponentProps>;

export function ConfigurationEditor({ loaderData, actionData }: Props) {
  const configuration = "configuration" in loaderData ? loaderData.configuration : null;
  const site = "site" in loaderData ? loaderData.site : null;
  if (!configuration && !site)
    return (
      <Editor.NoSiteYet title="New configuration">A configuration is a set of the site's stations.</Editor.NoSiteYet>
    );
  const defaults: Editor.Defaults = configuration
    ? {
        name: configuration.name,
        description: configuration.description,
        offered: configuration.offered ? "on" : "",
        stations: configuration.stationNames.join(" "),
      }
    : { offered: "on" };
  return (
    <Editor.Page
      noun="configuration"
      editing={configuration?.name ?? null}
      lead={
        "siteName" in loaderData
          ? `A station set of ${loaderData.siteName}.`
          : `A named set of ${site?.name}'s stations that cycles can offer.`
      }
      state={actionData}
      fields={CONFIGURATION_FIELDS}
      cancelTo={overviewHref(configuration?.siteId ?? site?.id)}
      below={
        configuration ? (
          <Editor.DeleteCard title="Delete this configuration" buttonLabel={`Delete ${configuration.name}`}>
            Its stations stay registered. To keep it but stop proposers from asking for it, untick “Offered to
            proposers” instead.
          </Editor.DeleteCard>
        ) : undefined
      }
    >
      {site ? <input type="hidden" name="siteId" value={site.id} /> : null}
      <ConfigurationFields
        state={actionData}
        defaults={defaults}
        stations={loaderData.stations}
        widest={loaderData.widest}
      />
    </Editor.Page>
  );
}
