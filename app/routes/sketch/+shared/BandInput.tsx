/** The instrument band of a sketch: every band of every instrument, with its channels as the hint. */
import { SelectField } from "~/components/ui";
import { describeChannels } from "~/engine";
import type { RegistryLike } from "~/services/sketch/registry";
import { plural } from "~/services/sketch/words";
import type { GroupProps } from "./InputGroup";

/** Instrument and band names joined in one option value (a character no name contains). */
const SEP = "\u001f";

export function BandInput({ state, set, errors, registry }: GroupProps & { registry: RegistryLike }) {
  const inst = registry.instruments.find((i) => i.name === state.instrument);
  const band = inst?.bands.find((b) => b.name === state.band);
  return (
    <SelectField
      label="Instrument band"
      name="band"
      value={`${state.instrument}${SEP}${state.band}`}
      error={errors.band}
      hint={
        band && inst
          ? `${describeChannels(band)}. ${inst.name} combines up to ${plural(inst.maxTelescopes, "telescope")}.`
          : "Channels spread evenly across the band."
      }
      onChange={(e) => {
        const [instrument, b] = e.target.value.split(SEP);
        set({ instrument, band: b });
      }}
    >
      {!band ? <option value={`${state.instrument}${SEP}${state.band}`}>Choose a band</option> : null}
      {registry.instruments.map((i) => (
        <optgroup key={i.name} label={i.name}>
          {i.bands.map((b) => (
            <option key={b.name} value={`${i.name}${SEP}${b.name}`}>
              {i.name} {b.name} — {(b.centralWavelengthM * 1e6).toFixed(2)} µm, {plural(b.channels, "channel")}
            </option>
          ))}
        </optgroup>
      ))}
    </SelectField>
  );
}
