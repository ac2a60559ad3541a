/** A cycle's score scale in words and steps (pure, safe in the browser). Default 1 = best … 5 = poorest. */

export type Scale = { best: number; worst: number };

/** "1 = best … 5 = poorest", shown beside every score. */
export function scaleText({ best, worst }: Scale): string {
  return `${best} = best … ${worst} = poorest`;
}

/** The whole-number steps of the scale, best first. */
export function scaleSteps({ best, worst }: Scale): number[] {
  const dir = worst > best ? 1 : -1;
  const out: number[] = [];
  for (let s = best; dir > 0 ? s <= worst : s >= worst; s += dir) out.push(s);
  return out;
}

/** Whether `score` lies on the scale, ends included (any value between them, not only whole steps). */
export function onScale(score: number, { best, worst }: Scale): boolean {
  return Number.isFinite(score) && score >= Math.min(best, worst) && score <= Math.max(best, worst);
}

/** Negative when `a` is better than `b` on this scale, positive when worse, 0 when equal. */
export function compareScores(a: number, b: number, { best, worst }: Scale): number {
  return best < worst ? a - b : b - a;
}

/** A step's label: "1 (best)", "3", "5 (poorest)". */
export function stepLabel(step: number, scale: Scale): string {
  if (step === scale.best) return `${step} (best)`;
  if (step === scale.worst) return `${step} (poorest)`;
  return String(step);
}
