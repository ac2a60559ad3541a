import { useEffect, useMemo, useRef, useState } from "react";
import { useSearchParams } from "react-router";
import type { StateDefaults } from "~/services/sketch/state";
import { useDebounced } from "./useDebounced";

/**
 * Form state that lives in the URL. Typing updates the state at once; after ~400 ms of quiet the
 * settled state is written to the address (replacing the history entry) and returned as `settled`,
 * which is what the page computes with. Back/forward or a pasted link replace the state.
 *
 * The search parameters named in `keep` (e.g. the site) are carried over as they are.
 */
export function useUrlState<S>(
  read: (params: URLSearchParams) => S,
  write: (state: S) => URLSearchParams,
  keep: readonly string[] = [],
  delayMs = 400,
) {
  const [searchParams, setSearchParams] = useSearchParams();
  // biome-ignore lint/correctness/useExhaustiveDependencies: `read` is a pure function of its argument (a new closure every render); only the address matters here.
  const fromUrl = useMemo(() => read(searchParams), [searchParams]);
  const [state, setState] = useState<S>(fromUrl);
  const written = useRef(searchParams.toString());

  // The address changed from outside (back/forward, a link): adopt it.
  useEffect(() => {
    const now = searchParams.toString();
    if (now !== written.current) {
      written.current = now;
      setState(fromUrl);
    }
  }, [searchParams, fromUrl]);

  const settled = useDebounced(state, delayMs);

  // biome-ignore lint/correctness/useExhaustiveDependencies: runs only when the settled state changes; the address it compares with (and its setter) is read at that moment. Re-running on an address change from outside would write the old state back over it.
  useEffect(() => {
    const next = write(settled);
    for (const k of keep) {
      const v = searchParams.get(k);
      if (v !== null) next.set(k, v);
    }
    const text = next.toString();
    if (text !== searchParams.toString()) {
      written.current = text;
      setSearchParams(next, { replace: true, preventScrollReset: true });
    }
  }, [settled]);

  return {
    state,
    settled,
    /** True while typing has not settled yet. */
    pending: state !== settled,
    set: (patch: Partial<S>) => setState((s) => ({ ...s, ...patch })),
    replace: setState,
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
