/** The sum of an array's values (a plain left-to-right sum, no compensation). */
export const sum = (a: ArrayLike<number>) => Array.from(a).reduce((s, x) => s + x, 0);
