/** The station editor, one component for the new and the edit page: the fields beside the site plan. */
import { useState } from "react";
import type { Route as EditRoute } from "../stations/+types/edit";
import type { Route as NewRoute } from "../stations/+types/new";
import * as Editor from "./EditorPage";
import { STATION_FIELDS, STATION_NAME_FIELD, STATION_POSITION_FIELDS } from "./fields";
import { overviewHref, stationHref } from "./links";
import { type MapStation, StationMap } from "./StationMap";

export const newStationMeta = () => Editor.meta("New station");
export const editStationMeta = ({ data }: EditRoute.MetaArgs) =>
  Editor.meta(`Edit station ${data?.station.name ?? ""}`);

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
  state: Editor.FormState;
  defaults: Editor.Defaults;
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
        <Editor.FieldList specs={[STATION_NAME_FIELD]} state={state} defaults={defaults} />
        <div className="grid grid-cols-2 gap-4">
          <Editor.FieldList specs={STATION_POSITION_FIELDS} state={state} defaults={defaults} />
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

/** A station's delete card: refused, and why, while a configuration uses it. */
function DeleteStationCard({ name, usedBy, refused }: { name: string; usedBy: string[]; refused?: string | null }) {
  return (
    <Editor.DeleteCard title="Delete this station" buttonLabel={`Delete ${name}`}>
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
    </Editor.DeleteCard>
  );
}

type Props = Editor.Props<NewRoute.ComponentProps, EditRoute.ComponentProps>;

export function StationEditor({ loaderData, actionData }: Props) {
  const edit = "station" in loaderData ? loaderData : null;
  const site = "site" in loaderData ? loaderData.site : null;
  if (!edit && !site)
    return <Editor.NoSiteYet title="New station">Stations are placed relative to a site.</Editor.NoSiteYet>;
  const station = edit?.station ?? null;
  const saveState = actionData?.deleteRefused ? null : actionData;
  return (
    <Editor.Page
      noun="station"
      editing={station?.name ?? null}
      lead={
        edit
          ? `A station of ${edit.siteName}. Configurations that use it follow its new position.`
          : `A station of ${site?.name}. The map shows where it falls among the others as you type.`
      }
      state={saveState}
      fields={STATION_FIELDS}
      cancelTo={station ? stationHref(station.id) : overviewHref(site?.id)}
      below={
        edit ? (
          <DeleteStationCard name={edit.station.name} usedBy={edit.usedBy} refused={actionData?.deleteRefused} />
        ) : undefined
      }
    >
      {site ? <input type="hidden" name="siteId" value={site.id} /> : null}
      <StationFields
        state={saveState}
        defaults={station ? Editor.defaultsOf(station, STATION_FIELDS) : { upM: "0", pathOffsetM: "0" }}
        stations={loaderData.stations}
        editing={station?.name ?? null}
      />
    </Editor.Page>
  );
}
