/** The station editor, one component for the new and the edit page: the fields beside the site plan. */
import { useState } from "react";
import type { Route as EditRoute } from "../stations/+types/edit";
import type { Route as NewRoute } from "../stations/+types/new";
import {
  type Defaults,
  DeleteCard,
  defaultsOf,
  EditorPage,
  FieldList,
  type FormState,
  NoSiteYet,
  registryTitle,
} from "./EditorPage";
import type { EditorState } from "./editor.server";
import { STATION_FIELDS, STATION_NAME_FIELD, STATION_POSITION_FIELDS } from "./fields";
import { overviewHref, stationHref } from "./links";
import { type MapStation, StationMap } from "./StationMap";

export const newStationMeta = () => registryTitle("New station");
export const editStationMeta = ({ data }: EditRoute.MetaArgs) =>
  registryTitle(`Edit station ${data?.station.name ?? ""}`);

/** The nearest neighbours of the station being edited, so the plan starts framed on it; null for a new one. */
function framing(stations: MapStation[], editing: string | null) {
  const self = stations.find((s) => s.name === editing);
  if (!self) return null;
  const distance = (s: MapStation) => Math.hypot(s.eastM - self.eastM, s.northM - self.northM);
  const near = stations.filter((s) => s.name !== editing).sort((a, b) => distance(a) - distance(b));
  return [self, ...near.slice(0, 6)];
}

/** Station fields beside the site plan, which shows the position as it is typed. */
function StationFields({
  state,
  defaults,
  stations,
  editing,
}: {
  state: FormState;
  defaults: Defaults;
  stations: MapStation[];
  /** The station being edited (drawn only at its typed position), or null for a new one. */
  editing: string | null;
}) {
  const start = (k: string) => state?.values?.[k] ?? defaults[k] ?? "";
  const [typed, setTyped] = useState({ name: start("name"), east: start("eastM"), north: start("northM") });
  const [frame] = useState(() => framing(stations, editing));
  const east = Number(typed.east.replace("−", "-"));
  const north = Number(typed.north.replace("−", "-"));
  const preview =
    typed.east.trim() !== "" && typed.north.trim() !== "" && Number.isFinite(east) && Number.isFinite(north)
      ? { name: typed.name.trim(), eastM: east, northM: north }
      : null;
  return (
    <div
      className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]"
      onInput={(e) => {
        const form = (e.target as HTMLInputElement).form;
        if (!form) return;
        const get = (k: string) => String(new FormData(form).get(k) ?? "");
        setTyped({ name: get("name"), east: get("eastM"), north: get("northM") });
      }}
    >
      <div className="grid content-start gap-4">
        <FieldList specs={[STATION_NAME_FIELD]} state={state} defaults={defaults} />
        <div className="grid grid-cols-2 gap-4">
          <FieldList specs={STATION_POSITION_FIELDS} state={state} defaults={defaults} />
        </div>
        <p className="text-sm text-night-600">
          East, north and up are metres from the array's reference point; the path offset is the station's fixed extra
          optical path.
        </p>
      </div>
      <StationMap
        stations={stations.filter((s) => s.name !== editing)}
        preview={preview}
        frame={frame}
        height={380}
        label="Site plan with the position as typed"
      />
    </div>
  );
}

type Props = {
  loaderData: NewRoute.ComponentProps["loaderData"] | EditRoute.ComponentProps["loaderData"];
  actionData?: EditorState;
};

export function StationEditor({ loaderData, actionData }: Props) {
  if (!("station" in loaderData)) {
    const { site } = loaderData;
    if (!site) return <NoSiteYet title="New station">Stations are placed relative to a site.</NoSiteYet>;
    return (
      <EditorPage
        title="New station"
        lead={`A station of ${site.name}. The map shows where it falls among the others as you type.`}
        state={actionData}
        fields={STATION_FIELDS}
        submitLabel="Add station"
        cancelTo={overviewHref(site.id)}
        ariaLabel="New station"
      >
        <input type="hidden" name="siteId" value={site.id} />
        <StationFields
          state={actionData}
          defaults={{ upM: "0", pathOffsetM: "0" }}
          stations={loaderData.stations}
          editing={null}
        />
      </EditorPage>
    );
  }
  const { station, usedBy } = loaderData;
  const defaults = defaultsOf(station, STATION_FIELDS);
  const refused = actionData?.deleteRefused;
  const saveState = refused ? null : actionData;
  const deleteCard = (
    <DeleteCard title="Delete this station" buttonLabel={`Delete ${station.name}`}>
      {refused ? (
        <p
          role="alert"
          className="mb-2 rounded-lg border border-danger-700/30 bg-danger-50 p-3 font-medium text-danger-700"
        >
          {refused}
        </p>
      ) : null}
      {usedBy.length > 0
        ? `Used by ${usedBy.join(", ")}: a station in a configuration cannot be deleted.`
        : "No configuration uses this station. Deleting it cannot be undone."}
    </DeleteCard>
  );
  return (
    <EditorPage
      title={`Edit station ${station.name}`}
      lead={`A station of ${loaderData.siteName}. Configurations that use it follow its new position.`}
      state={saveState}
      fields={STATION_FIELDS}
      submitLabel="Save station"
      cancelTo={stationHref(station.id)}
      ariaLabel={`Edit station ${station.name}`}
      below={deleteCard}
    >
      <StationFields state={saveState} defaults={defaults} stations={loaderData.stations} editing={station.name} />
    </EditorPage>
  );
}
