/**
 * The shape of a target model as it arrives (JSON, before or after validation): how many components it
 * has in all and how deep its `sum`s are nested. Walked with an explicit stack, never by recursion, so
 * a model nested thousands deep (a 2 MB body holds about 45 000 levels) is measured, not a stack
 * overflow; the model schema refuses it before its own recursive checks run. Pure.
 */

/** Most levels of `sum` a model may have: a sum given as the target's model is level 1. */
export const MAX_SUM_DEPTH = 4;
/** Most components a model may have in all: every model that is not itself a sum, at any depth. */
export const MAX_MODEL_COMPONENTS = 50;

export interface ModelShape {
  /** Models that are not sums, at every depth (a model that is not a sum is one component). */
  components: number;
  /** Levels of sums: 0 for a model that is not a sum, 1 for a sum of plain models. */
  sumDepth: number;
}

type Json = Record<string, unknown>;
const isObject = (x: unknown): x is Json => typeof x === "object" && x !== null && !Array.isArray(x);

/** The components of a sum as given, or null when `model` is not a sum with a component list. */
function sumComponents(model: unknown): unknown[] | null {
  if (!isObject(model) || model.type !== "sum" || !Array.isArray(model.components)) return null;
  return model.components;
}

/**
 * Components and sum depth of a model as given. Anything that is not a sum with a component list
 * counts as one component (the schema names what is wrong with it).
 */
export function modelShape(model: unknown): ModelShape {
  let components = 0;
  let sumDepth = 0;
  const stack: { model: unknown; depth: number }[] = [{ model, depth: 0 }];
  for (let top = stack.pop(); top !== undefined; top = stack.pop()) {
    const list = sumComponents(top.model);
    if (list === null) {
      components++;
      continue;
    }
    const depth = top.depth + 1;
    if (depth > sumDepth) sumDepth = depth;
    for (const c of list) stack.push({ model: isObject(c) ? c.model : undefined, depth });
  }
  return { components, sumDepth };
}

/** Digits in groups of three, separated by spaces: 20000000 → "20 000 000". */
export function grouped(n: number): string {
  return Math.round(n)
    .toString()
    .replace(/\B(?=(\d{3})+(?!\d))/g, " ");
}

/** Why a model's shape is refused (nesting first, then the component count), or null. */
export function modelShapeFailure(model: unknown): string | null {
  const shape = modelShape(model);
  if (shape.sumDepth > MAX_SUM_DEPTH) {
    return `sums nested ${grouped(shape.sumDepth)} deep (at most ${MAX_SUM_DEPTH} levels of sums)`;
  }
  if (shape.components > MAX_MODEL_COMPONENTS) {
    return `${grouped(shape.components)} components in all, counting those of nested sums (at most ${MAX_MODEL_COMPONENTS})`;
  }
  return null;
}
