import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { useSearchParams } from "react-router";
import type { StateDefaults } from "~/services/sketch/state";

/** Quiet time after the last keystroke before typed text is computed with, milliseconds. */
export const TYPING_SETTLE_MS = 180;
/** Wait before the settled state is written to the address, milliseconds (once the answer is drawn). */
export const ADDRESS_DELAY_MS = 400;

/** How an input changed the state: a pick (select, checkbox, toggle, button) or typing. */
export type ChangeKind = "pick" | "typing";

/**
 * Form state that lives in the URL. Every change updates `state` at once. A pick also settles it at
 * once; typing settles it after `TYPING_SETTLE_MS` of quiet. `settled` is what the page computes
 * with, and `changedAt` (performance.now() of the last change it includes) is when the person made
 * it, so the page can tell how long the answer took. The settled state is written to the address a
 * moment later, replacing the history entry in place (history.replaceState with the router's own
 * entry state): a router navigation would render the whole page again and ask the server for the
 * root's data on every change, for an address that only records the inputs. Back/forward or a pasted
 * link replace the state (the router sees those).
 *
 * The search parameters named in `keep` (e.g. the site) are carried over as they are.
 */
export function useUrlState<S>(
  read: (params: URLSearchParams) => S,
  write: (state: S) => URLSearchParams,
  keep: readonly string[] = [],
  delayMs = TYPING_SETTLE_MS,
) {
  const [searchParams] = useSearchParams();
  // biome-ignore lint/correctness/useExhaustiveDependencies: `read` is a pure function of its argument (a new closure every render); only the address matters here.
  const fromUrl = useMemo(() => read(searchParams), [searchParams]);
  const [state, setState] = useState<S>(fromUrl);
  const [settled, setSettled] = useState<{ state: S; changedAt: number }>({ state: fromUrl, changedAt: 0 });
  const latest = useRef(state);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const written = useRef(searchParams.toString());

  // The address changed from outside (back/forward, a link): adopt it.
  useEffect(() => {
    const now = searchParams.toString();
    if (now !== written.current) {
      written.current = now;
      latest.current = fromUrl;
      setState(fromUrl);
      setSettled({ state: fromUrl, changedAt: performance.now() });
    }
  }, [searchParams, fromUrl]);

  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  // biome-ignore lint/correctness/useExhaustiveDependencies: runs only when the settled state changes; the address is read when the write happens. Re-running on an address change from outside would write the old state back over it.
  useEffect(() => {
    const timer = setTimeout(() => {
      const now = new URLSearchParams(window.location.search);
      const next = write(settled.state);
      for (const k of keep) {
        const v = now.get(k);
        if (v !== null) next.set(k, v);
      }
      const text = next.toString();
      if (text !== now.toString()) {
        written.current = text;
        window.history.replaceState(
          window.history.state,
          "",
          `${window.location.pathname}?${text}${window.location.hash}`,
        );
      }
    }, ADDRESS_DELAY_MS);
    return () => clearTimeout(timer);
  }, [settled.state]);

  const change = useCallback(
    (patch: Partial<S>, kind: ChangeKind) => {
      const next = { ...latest.current, ...patch };
      latest.current = next;
      setState(next);
      const at = performance.now();
      if (timer.current) clearTimeout(timer.current);
      timer.current = null;
      if (kind === "pick") setSettled({ state: next, changedAt: at });
      else {
        timer.current = setTimeout(() => {
          timer.current = null;
          setSettled({ state: latest.current, changedAt: at });
        }, delayMs);
      }
    },
    [delayMs],
  );
  const set = useCallback((patch: Partial<S>) => change(patch, "pick"), [change]);
  const type = useCallback((patch: Partial<S>) => change(patch, "typing"), [change]);

  return {
    state,
    settled: settled.state,
    /** performance.now() of the last change the settled state includes (0: as the page opened). */
    changedAt: settled.changedAt,
    /** True while typing has not settled yet. */
    pending: state !== settled.state,
    /** A pick: computed with at once. */
    set,
    /** Typing: computed with once the typing pauses. */
    type,
  };
}

/** How a page's state is read from (with the registry's defaults) and written to its address. */
export interface StateCodec<S> {
  read: (params: URLSearchParams, defaults: StateDefaults) => S;
  write: (state: S) => URLSearchParams;
}

/**
 * The state of the Sketchpad or the Triangle finder in the URL: read with the page's defaults; the
 * site is carried over when there are several to choose from.
 */
export function useSketchState<S>(codec: StateCodec<S>, page: { defaults: StateDefaults; multiSite: boolean }) {
  return useUrlState<S>((p) => codec.read(p, page.defaults), codec.write, page.multiSite ? ["site"] : []);
}
