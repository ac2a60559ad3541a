/**
 * A target's name field that knows the star catalogue: names to pick from as one types (SWR over
 * `GET /api/stars?q=…`), and under the field the star the text names — its designations, V and B−V and
 * J2000 position — or, for a name no star carries, that it is not a catalogue star (the text is kept:
 * an invented or faint target is named as the person likes and given coordinates by hand).
 *
 * Picking a suggestion fills the coordinates (`fill`: the names of the form's RA and Dec inputs, for an
 * uncontrolled form; `onResolved`: for a page that holds its own state); a name typed in full offers a
 * "Use its coordinates" button instead, so typing never overwrites coordinates unasked. Changing the name
 * afterwards clears the coordinates it filled (unless they were edited since): they were that star's.
 *
 * Keyboard: ↓/↑ move through the suggestions, Enter picks, Escape closes (ARIA combobox pattern).
 */
import { type KeyboardEvent, type ReactNode, useEffect, useId, useRef, useState } from "react";
import useSWR from "swr";
import type { ResolveResponse } from "~/engine";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import type { StarSuggestion, StarSuggestions } from "~/services/catalogue/wire";
import { Button } from "../ui/Button";
import { cx } from "../ui/cx";
import { type CatalogueApiError, getJson, SWR_OPTIONS } from "./fetch";

export type StarNameFieldProps = {
  label: string;
  /** The form field's name (an uncontrolled form posts the text under it). */
  name?: string;
  defaultValue?: string;
  /** Controlled text (with onValueChange). */
  value?: string;
  onValueChange?: (text: string) => void;
  /** A star was picked from the suggestions ("picked") or its coordinates were asked for ("typed"). */
  onResolved?: (star: ResolveResponse, how: "picked" | "typed") => void;
  /** The names of the form's RA and Dec inputs to fill with the star's J2000 position. */
  fill?: { ra: string; dec: string };
  error?: string;
  hint?: ReactNode;
  maxLength?: number;
  placeholder?: string;
  required?: boolean;
  id?: string;
};

/** Delay after the last keystroke before the catalogue is asked, ms. */
const DEBOUNCE_MS = 180;

const control =
  "block w-full rounded-lg border bg-white px-3 py-2 text-night-900 placeholder:text-night-400 " +
  "focus:outline-none focus-visible:outline-3 focus-visible:outline-ember-500 focus-visible:outline-offset-1";

function useDebounced(text: string, ms: number): string {
  const [value, setValue] = useState(text);
  useEffect(() => {
    const t = setTimeout(() => setValue(text), ms);
    return () => clearTimeout(t);
  }, [text, ms]);
  return value;
}

/** The star's position as the target fields take it. */
export function starCoordinates(star: Pick<ResolveResponse, "raDeg" | "decDeg">) {
  return { ra: formatRightAscension(star.raDeg, 2), dec: formatDeclination(star.decDeg, 1) };
}

/** Sets an uncontrolled input of the same form, as if typed (so other listeners hear it). */
function setFormField(form: HTMLFormElement | null | undefined, name: string, value: string) {
  const el = form?.elements.namedItem(name);
  if (!(el instanceof HTMLInputElement)) return;
  el.value = value;
  el.dispatchEvent(new Event("input", { bubbles: true }));
}

/** The resolved star: designations, photometry, position. */
function StarFacts({ star }: { star: ResolveResponse }) {
  const { ra, dec } = starCoordinates(star);
  const others = star.designations.filter((d) => d !== star.name);
  return (
    <div className="text-sm text-night-700">
      <p>
        <span className="font-semibold text-night-900">{star.name}</span>
        {others.length ? <span> · {others.join(" · ")}</span> : null}
      </p>
      <p className="num">
        V {star.vMag.toFixed(2)} · B−V {star.bv === null ? "not given" : star.bv.toFixed(2)} · RA {ra} · Dec {dec}{" "}
        (J2000)
      </p>
      {star.matchedBy === "typo" ? (
        <p className="text-caution-700">Read as {star.name} (a small typo forgiven).</p>
      ) : null}
      {star.alsoNamed.length ? (
        <p className="text-night-600">The name is shared: the brightest is shown; also {star.alsoNamed.join(", ")}.</p>
      ) : null}
    </div>
  );
}

export function StarNameField(props: StarNameFieldProps) {
  const { label, name, fill, onResolved, error, hint, maxLength = 80, placeholder, required } = props;
  const auto = useId();
  const id = props.id ?? auto;
  const listId = `${id}-suggestions`;
  const inputRef = useRef<HTMLInputElement>(null);
  const [own, setOwn] = useState(props.defaultValue ?? "");
  const text = props.value ?? own;
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);
  /** The star picked from the list (looked up by its number, so a shared name cannot mislead). */
  const [picked, setPicked] = useState<{ hip: number; fill: boolean } | null>(null);
  const [filled, setFilled] = useState<number | null>(null);
  /** The coordinates this field wrote into the form, to take back when the name changes. */
  const wrote = useRef<{ ra: string; dec: string } | null>(null);

  const debounced = useDebounced(text.trim(), DEBOUNCE_MS);
  const query = picked ? `HIP ${picked.hip}` : debounced;
  const key = query.length >= 2 ? `/api/stars?q=${encodeURIComponent(query)}` : null;
  const {
    data,
    error: fetchError,
    isLoading,
  } = useSWR<StarSuggestions, CatalogueApiError, string | null>(key, getJson<StarSuggestions>, SWR_OPTIONS);
  const current = data && key !== null && data.query === query ? data : null;
  const star = current?.star ?? null;
  const suggestions = picked ? [] : (current?.suggestions ?? []);
  const showList = open && suggestions.length > 0;

  const setText = (next: string) => {
    if (props.value === undefined) setOwn(next);
    props.onValueChange?.(next);
  };

  const applyStar = (s: ResolveResponse, how: "picked" | "typed") => {
    if (fill) {
      const { ra, dec } = starCoordinates(s);
      setFormField(inputRef.current?.form, fill.ra, ra);
      setFormField(inputRef.current?.form, fill.dec, dec);
      wrote.current = { ra, dec };
    }
    onResolved?.(s, how);
    setFilled(s.hip);
  };

  // A picked star fills the coordinates once its details have arrived.
  useEffect(() => {
    if (picked?.fill && star && star.hip === picked.hip) {
      setPicked({ hip: picked.hip, fill: false });
      applyStar(star, "picked");
    }
  });

  const pick = (s: StarSuggestion) => {
    setText(s.name);
    setPicked({ hip: s.hip, fill: true });
    setOpen(false);
    setActive(-1);
  };

  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === "ArrowDown" && suggestions.length) {
      e.preventDefault();
      setOpen(true);
      setActive((a) => (a + 1) % suggestions.length);
    } else if (e.key === "ArrowUp" && suggestions.length) {
      e.preventDefault();
      setOpen(true);
      setActive((a) => (a <= 0 ? suggestions.length - 1 : a - 1));
    } else if (e.key === "Enter" && showList && active >= 0) {
      e.preventDefault();
      pick(suggestions[active]);
    } else if (e.key === "Escape" && showList) {
      e.preventDefault();
      setOpen(false);
    }
  };

  const canUse = Boolean(fill || onResolved);
  const describedBy = [error ? `${id}-error` : null, `${id}-status`].filter(Boolean).join(" ");
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-night-800">
        {label}
      </label>
      <div className="relative">
        <input
          ref={inputRef}
          id={id}
          name={name}
          value={text}
          onChange={(e) => {
            // Coordinates taken from the previous name belong to that star: cleared, unless edited since.
            const form = inputRef.current?.form;
            if (fill && wrote.current && form) {
              const field = (n: string) => form.elements.namedItem(n) as HTMLInputElement | null;
              if (field(fill.ra)?.value === wrote.current.ra && field(fill.dec)?.value === wrote.current.dec) {
                setFormField(form, fill.ra, "");
                setFormField(form, fill.dec, "");
              }
              wrote.current = null;
            }
            setText(e.target.value);
            setPicked(null);
            setFilled(null);
            setOpen(true);
            setActive(-1);
          }}
          onKeyDown={onKeyDown}
          onFocus={() => setOpen(true)}
          onBlur={() => setOpen(false)}
          role="combobox"
          aria-expanded={showList}
          aria-controls={listId}
          aria-autocomplete="list"
          aria-activedescendant={showList && active >= 0 ? `${listId}-${active}` : undefined}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          autoComplete="off"
          spellCheck={false}
          maxLength={maxLength}
          placeholder={placeholder}
          required={required}
          className={cx(control, error ? "border-danger-700" : "border-night-300")}
        />
        <div
          id={listId}
          role="listbox"
          aria-label="Star suggestions"
          hidden={!showList}
          className="absolute z-20 mt-1 max-h-72 w-full overflow-auto rounded-lg bg-white py-1 shadow-lg ring-1 ring-night-200"
        >
          {suggestions.map((s, i) => (
            <div
              key={s.hip}
              tabIndex={-1}
              id={`${listId}-${i}`}
              role="option"
              aria-selected={i === active}
              // Picking on mouse-down keeps the focus (and the list) until the pick is made.
              onMouseDown={(e) => {
                e.preventDefault();
                pick(s);
              }}
              className={cx(
                "flex cursor-pointer items-baseline justify-between gap-3 px-3 py-1.5 text-sm",
                i === active ? "bg-ember-50 text-night-900" : "text-night-800 hover:bg-night-50",
              )}
            >
              <span>
                {s.name}
                {s.also ? <span className="text-night-500"> · {s.also}</span> : null}
              </span>
              <span className="num shrink-0 text-night-600">V {s.vMag.toFixed(2)}</span>
            </div>
          ))}
        </div>
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-danger-700">
          {error}
        </p>
      ) : null}
      <div id={`${id}-status`} aria-live="polite" className="min-h-5">
        {star ? (
          <div className="mt-1 flex flex-wrap items-start justify-between gap-2 rounded-lg bg-night-50 p-2 ring-1 ring-night-200">
            <StarFacts star={star} />
            {canUse && filled !== star.hip ? (
              <Button variant="secondary" size="sm" onClick={() => applyStar(star, "typed")}>
                Use its coordinates
              </Button>
            ) : null}
            {canUse && filled === star.hip ? <span className="text-sm text-ok-700">Coordinates filled in.</span> : null}
          </div>
        ) : current?.message && !error ? (
          <p className="text-sm text-night-700">
            Not in the star catalogue: {current.message}. The name is kept as typed; give its coordinates.
          </p>
        ) : fetchError ? (
          <p className="text-sm text-caution-700">The catalogue could not be asked: {fetchError.message}</p>
        ) : isLoading && key ? (
          <p className="text-sm text-night-500">Looking the name up…</p>
        ) : hint ? (
          <p className="text-sm text-night-600">{hint}</p>
        ) : null}
      </div>
    </div>
  );
}
