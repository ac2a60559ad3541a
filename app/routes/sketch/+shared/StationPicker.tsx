/**
 * Stations for a sketch: a configuration from the registry, or a free pick on the station map (click a
 * station) or with the checkboxes below it (keyboard). Picking on the map while a configuration is
 * chosen starts a free pick from that configuration's stations.
 */
import { useMemo } from "react";
import { Plot, plotLayout, stationPoints } from "~/components/plots/Plot";
import { extent, namesWithRoom } from "~/components/plots/station-spacing";
import { SelectField } from "~/components/ui";
import type { FieldErrors } from "~/services/sketch/inputs";
import { pickedStations, type RegistryLike } from "~/services/sketch/registry";
import type { SketchState } from "~/services/sketch/state";
import { plural } from "~/services/sketch/words";
import { binder, InputGroup } from "./InputGroup";

const FREE = "";
const MAP_CONFIG = { displayModeBar: false, scrollZoom: false };
type Station = RegistryLike["stations"][number];

/** Width of the map's drawing area in the input column, pixels (the column is about 240 px wide). */
const MAP_DRAWING_PX = 190;

/**
 * The map's markers of some stations: filled when in the sketch, hollow when not. A name is drawn
 * only where it has room (`hasRoom`); a packed core's names are on hover and in the checkbox list.
 */
function stationTrace(list: readonly Station[], chosen: boolean, hasRoom: (name: string) => boolean) {
  return {
    type: "scatter",
    mode: "markers+text",
    name: chosen ? "In the sketch" : "Not used",
    ...stationPoints(list),
    text: list.map((s) => (hasRoom(s.name) ? s.name : "")),
    customdata: list.map((s) => s.name),
    textposition: "top center",
    textfont: { size: 10, color: chosen ? "#7f2e14" : "#56637f" },
    marker: chosen
      ? { size: 12, color: "#a03611", line: { color: "#672813", width: 1 } }
      : { size: 9, color: "#ffffff", line: { color: "#7583a3", width: 1.5 } },
    hovertemplate: `%{customdata}<br>east %{x:.1f} m, north %{y:.1f} m<br>${chosen ? "click to remove" : "click to add"}<extra></extra>`,
    cliponaxis: false,
  };
}

export function StationPicker({
  state,
  set,
  errors,
  registry,
}: {
  state: SketchState;
  set: (patch: Partial<SketchState>) => void;
  errors: FieldErrors;
  registry: RegistryLike;
}) {
  const picked = pickedStations(state, registry);
  const pickedSet = new Set(picked);

  // Switching to a free pick starts from the stations shown now.
  const pickConfig = (patch: Partial<SketchState>) =>
    set(patch.config === FREE ? { config: FREE, stations: picked } : { config: patch.config });

  function toggle(name: string) {
    const next = new Set(picked);
    if (next.has(name)) next.delete(name);
    else next.add(name);
    set({ config: FREE, stations: registry.stations.filter((s) => next.has(s.name)).map((s) => s.name) });
  }

  const pickedKey = picked.join(",");
  // Drawn again only when the pick changes (not while a field elsewhere is being typed in).
  // biome-ignore lint/correctness/useExhaustiveDependencies: the pick is read through its key.
  const data = useMemo(() => {
    const on = registry.stations.filter((s) => pickedSet.has(s.name));
    const off = registry.stations.filter((s) => !pickedSet.has(s.name));
    const room = namesWithRoom(registry.stations, extent(registry.stations) / MAP_DRAWING_PX);
    const roomy = new Set(registry.stations.filter((_, i) => room[i]).map((s) => s.name));
    const hasRoom = (name: string) => roomy.has(name);
    return [stationTrace(off, false, hasRoom), stationTrace(on, true, hasRoom)];
  }, [pickedKey, registry.stations]);
  const layout = useMemo(
    () =>
      plotLayout({
        margin: { l: 44, r: 8, t: 8, b: 40 },
        showlegend: false,
        xaxis: { title: { text: "East (m) →", standoff: 4 }, zeroline: false },
        yaxis: { title: { text: "North (m)", standoff: 4 }, scaleanchor: "x", scaleratio: 1, zeroline: false },
        dragmode: "pan",
        uirevision: "stations",
        font: { size: 11 },
      }),
    [],
  );

  return (
    <InputGroup title="Stations">
      <SelectField
        label="Configuration"
        {...binder(state, pickConfig)("config")}
        error={errors.stations}
        hint={
          state.config === FREE
            ? `${plural(picked.length, "station")} picked on the map or below.`
            : `${picked.join(" · ")}`
        }
      >
        {registry.configurations.map((c) => (
          <option key={c.name} value={c.name}>
            {c.name} ({plural(c.stationNames.length, "station")})
          </option>
        ))}
        <option value={FREE}>Free pick of stations</option>
      </SelectField>
      <Plot
        label="Station map: east and north of each station in metres; picked stations are filled"
        height={260}
        data={data}
        layout={layout}
        config={MAP_CONFIG}
        onClick={(event: { points?: { customdata?: unknown }[] }) => {
          const name = event.points?.[0]?.customdata;
          if (typeof name === "string") toggle(name);
        }}
      />
      <details className="text-sm" open={state.config === FREE}>
        <summary className="cursor-pointer font-medium text-night-800">
          Pick stations with checkboxes (names of close-packed stations are here and on hover)
        </summary>
        <div className="mt-2 grid grid-cols-4 gap-x-2 gap-y-1">
          {registry.stations.map((s) => (
            <label key={s.name} className="flex items-center gap-1">
              <input
                type="checkbox"
                name="station"
                value={s.name}
                checked={pickedSet.has(s.name)}
                onChange={() => toggle(s.name)}
              />
              <span className="num">{s.name}</span>
            </label>
          ))}
        </div>
      </details>
    </InputGroup>
  );
}
