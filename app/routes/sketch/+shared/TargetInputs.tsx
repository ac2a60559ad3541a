/**
 * The target of a sketch: picked from the person's own targets, a star of the catalogue by name (its
 * coordinates filled in), or a name and J2000 coordinates typed in sexagesimal or decimal form, each
 * with the reading of what was typed as its hint.
 */
import { StarNameField, starCoordinates } from "~/components/catalogue/StarNameField";
import { Button, SelectField, TextField } from "~/components/ui";
import { formatDeclination, formatRightAscension, parseDeclination, parseRightAscension } from "~/lib/coordinates";
import { modelInputsOf, type SavedTarget } from "~/services/sketch/models";
import { binder, type GroupProps, InputGroup } from "./InputGroup";

const COORDINATES = [
  {
    key: "ra",
    label: "Right ascension",
    placeholder: "05:36:12.8 or 84.05",
    parse: parseRightAscension,
    format: formatRightAscension,
    hint: "hh:mm:ss.s (hours) or decimal degrees, J2000",
  },
  {
    key: "dec",
    label: "Declination",
    placeholder: "-01:12:07 or -1.2",
    parse: parseDeclination,
    format: formatDeclination,
    hint: "±dd:mm:ss or decimal degrees, J2000",
  },
] as const;

function SavedTargetPicker({ savedTargets, set }: Pick<GroupProps, "set"> & { savedTargets: SavedTarget[] }) {
  return (
    <SelectField
      label="From My targets"
      name="saved"
      value=""
      onChange={(e) => {
        const t = savedTargets.find((x) => String(x.id) === e.target.value);
        if (!t) return;
        set({
          name: t.name,
          ra: formatRightAscension(t.raDeg, 2),
          dec: formatDeclination(t.decDeg, 1),
          ...modelInputsOf(t.model),
        });
      }}
    >
      <option value="">— pick one to fill the fields —</option>
      {savedTargets.map((t) => (
        <option key={t.id} value={t.id}>
          {t.name}
        </option>
      ))}
    </SelectField>
  );
}

export function TargetInputs({
  state,
  set,
  type,
  errors,
  onExample,
  savedTargets = [],
}: GroupProps & {
  /** Fills a target that is up tonight (shown while no coordinates are typed). */
  onExample?: () => void;
  /** The person's own targets ("My targets"); picking one fills name, coordinates and model. */
  savedTargets?: SavedTarget[];
}) {
  const field = binder(state, set, type);
  return (
    <InputGroup title="Target">
      {savedTargets.length > 0 ? <SavedTargetPicker savedTargets={savedTargets} set={set} /> : null}
      <StarNameField
        label="Name"
        name="name"
        value={state.name}
        onValueChange={(name) => type({ name })}
        onResolved={(star) => set({ name: star.name, ...starCoordinates(star) })}
        maxLength={200}
        placeholder="optional: a star's name fills its coordinates"
        error={errors.name}
      />
      {COORDINATES.map((c) => {
        const read = c.parse(state[c.key]);
        return (
          <TextField
            key={c.key}
            label={c.label}
            {...field(c.key)}
            autoComplete="off"
            spellCheck={false}
            placeholder={c.placeholder}
            error={errors[c.key]}
            hint={
              read.ok ? (
                <>
                  Reads as{" "}
                  <abbr className="num no-underline" title={`${read.deg.toFixed(4)}°`}>
                    {c.format(read.deg)}
                  </abbr>{" "}
                  (J2000)
                </>
              ) : (
                c.hint
              )
            }
          />
        );
      })}
      {onExample && state.ra.trim() === "" && state.dec.trim() === "" ? (
        <Button variant="secondary" size="sm" onClick={onExample}>
          Try a target that is up tonight
        </Button>
      ) : null}
    </InputGroup>
  );
}
