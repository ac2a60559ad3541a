import { useEffect, useState } from "react";

/** `value`, once it has stayed unchanged for `delayMs` (the Sketchpad waits ~400 ms of quiet typing). */
export function useDebounced<T>(value: T, delayMs = 400): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const timer = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(timer);
  }, [value, settled, delayMs]);
  return settled;
}
