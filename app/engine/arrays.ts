/**
 * Typed-array factories shared across the engine. Imports nothing, so every folder may depend on it.
 */

/** A tuple of `N` elements of type T (a plain array when N is not a literal). */
export type TupleOf<T, N extends number, R extends T[] = []> = number extends N
  ? T[]
  : R["length"] extends N
    ? R
    : TupleOf<T, N, [T, ...R]>;

/**
 * `count` separate zero-filled Float64Arrays of `length` elements each, for destructuring into named
 * columns or work vectors of one size: `const [xM, yM, zM] = float64Arrays(3, n)`. With a literal
 * count the result is a tuple of that length, so naming one array too many is a type error.
 */
export function float64Arrays<N extends number>(count: N, length: number): TupleOf<Float64Array, N> {
  return Array.from({ length: count }, () => new Float64Array(length)) as TupleOf<Float64Array, N>;
}
