/**
 * The order in which the page's plots are drawn. Every Plot hands its next draw (a Plotly call) to
 * this queue instead of drawing at once: the light figures (lines and markers) are drawn first, one
 * after the other in one go, then the browser gets a frame to paint them, then the heavy ones
 * (heatmaps). A plot that is asked to draw again before its turn keeps only its newest draw.
 *
 * `whenDrawn()` resolves once nothing is left to draw; a page uses it to tell when what it shows is
 * on screen. Browser only; one queue per page (the module's state is the page's plots).
 */

export type DrawPriority = "light" | "heavy";

type Job = () => Promise<void> | void;

const queues: Record<DrawPriority, Map<object, Job>> = { light: new Map(), heavy: new Map() };
let running: Promise<void> | null = null;

function nextFrame(): Promise<void> {
  return new Promise((resolve) => {
    if (typeof requestAnimationFrame === "function") requestAnimationFrame(() => resolve());
    else setTimeout(resolve, 0);
  });
}

function takeFirst(map: Map<object, Job>): Job | undefined {
  for (const [owner, job] of map) {
    map.delete(owner);
    return job;
  }
  return undefined;
}

async function runSafely(job: Job) {
  try {
    await job();
  } catch (e) {
    // One plot that cannot be drawn must not keep the others from being drawn.
    console.error(e);
  }
}

async function drain() {
  // Let every plot of the same commit put in its draw first.
  await Promise.resolve();
  while (queues.light.size > 0 || queues.heavy.size > 0) {
    let job = takeFirst(queues.light);
    if (job) {
      await runSafely(job);
      if (queues.light.size === 0 && queues.heavy.size > 0) await nextFrame();
      continue;
    }
    job = takeFirst(queues.heavy);
    if (job) await runSafely(job);
  }
}

/** Puts the next draw of `owner` (a plot) in the queue, replacing one it had waiting. */
export function scheduleDraw(owner: object, priority: DrawPriority, job: Job) {
  queues[priority === "light" ? "heavy" : "light"].delete(owner);
  queues[priority].set(owner, job);
  if (!running) {
    running = drain().finally(() => {
      running = null;
    });
  }
}

/** Forgets the waiting draw of `owner` (a plot being removed). */
export function cancelDraw(owner: object) {
  queues.light.delete(owner);
  queues.heavy.delete(owner);
}

/** Resolves once every waiting draw has been made (at once when nothing waits). */
export function whenDrawn(): Promise<void> {
  return running ?? Promise.resolve();
}

/** True while a draw waits or is being made. */
export function isDrawing(): boolean {
  return running !== null;
}
