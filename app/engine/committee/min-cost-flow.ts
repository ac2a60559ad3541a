/**
 * Minimum-cost flow with convex arc costs, by successive shortest paths (one unit per augmentation,
 * shortest paths by the queue-based Bellman–Ford method, which accepts the negative costs of residual
 * reverse arcs). Textbook method: Ahuja, Magnanti & Orlin, *Network Flows* (1993), the chapters on
 * minimum-cost flows (successive shortest paths) and on convex-cost flows (convex costs as unit
 * increments) — chapter references from memory.
 *
 * Arc costs are convex and piecewise linear in the flow: the (j+1)-th unit on an arc costs
 * base + slope·j (slope ≥ 0). The residual forward arc costs the next unit's marginal cost and the
 * reverse arc minus the last unit's, so after each shortest-path augmentation the residual graph has
 * no negative cycle and the final flow is a minimum-cost flow of its value. Costs are integers in
 * practice (exact in doubles below 2^53). Deterministic: arcs are scanned in the order they were added
 * and ties keep the first path found.
 */

export class ConvexFlowNetwork {
  private readonly nNodes: number;
  private from: number[] = [];
  private to: number[] = [];
  private cap: number[] = [];
  private flow: number[] = [];
  private base: number[] = [];
  private slope: number[] = [];
  /** Per node: residual entries 2e (forward of arc e) and 2e+1 (its reverse). */
  private adjacency: number[][];

  constructor(nNodes: number) {
    this.nNodes = nNodes;
    this.adjacency = Array.from({ length: nNodes }, () => []);
  }

  /** Adds an arc of capacity `capacity` whose (j+1)-th unit costs base + slope·j; returns its id. */
  addArc(from: number, to: number, capacity: number, base: number, slope = 0): number {
    if (!(slope >= 0)) throw new RangeError("arc costs must be convex (slope ≥ 0)");
    const e = this.to.length;
    this.from.push(from);
    this.to.push(to);
    this.cap.push(capacity);
    this.flow.push(0);
    this.base.push(base);
    this.slope.push(slope);
    this.adjacency[from].push(2 * e);
    this.adjacency[to].push(2 * e + 1);
    return e;
  }

  /** Flow on arc `e`. */
  flowOn(e: number): number {
    return this.flow[e];
  }

  /** Residual cost of entry k, or NaN when it has no residual capacity. */
  private residualCost(k: number): number {
    const e = k >> 1;
    const f = this.flow[e];
    if ((k & 1) === 0) return f < this.cap[e] ? this.base[e] + this.slope[e] * f : Number.NaN;
    return f > 0 ? -(this.base[e] + this.slope[e] * (f - 1)) : Number.NaN;
  }

  /**
   * Sends up to `maxFlow` units from `source` to `sink` at least cost; returns the flow sent (the
   * maximum flow when maxFlow is not reached) and its cost.
   */
  run(source: number, sink: number, maxFlow = Number.POSITIVE_INFINITY): { flow: number; cost: number } {
    const n = this.nNodes;
    const dist = new Float64Array(n);
    const prev = new Int32Array(n);
    const inQueue = new Uint8Array(n);
    const pops = new Int32Array(n);
    const queue = new Int32Array(n + 1);
    let sent = 0;
    let cost = 0;
    while (sent < maxFlow) {
      dist.fill(Number.POSITIVE_INFINITY);
      prev.fill(-1);
      pops.fill(0);
      dist[source] = 0;
      let head = 0;
      let tail = 0;
      queue[tail++] = source;
      inQueue[source] = 1;
      while (head !== tail) {
        const u = queue[head];
        head = head === n ? 0 : head + 1;
        inQueue[u] = 0;
        if (++pops[u] > n) throw new Error("negative cycle in the residual network");
        const du = dist[u];
        for (const k of this.adjacency[u]) {
          const c = this.residualCost(k);
          if (Number.isNaN(c)) continue;
          const v = (k & 1) === 0 ? this.to[k >> 1] : this.from[k >> 1];
          if (du + c < dist[v]) {
            dist[v] = du + c;
            prev[v] = k;
            if (!inQueue[v]) {
              inQueue[v] = 1;
              queue[tail] = v;
              tail = tail === n ? 0 : tail + 1;
            }
          }
        }
      }
      if (dist[sink] === Number.POSITIVE_INFINITY) break;
      for (let v = sink; v !== source; ) {
        const k = prev[v];
        const e = k >> 1;
        if ((k & 1) === 0) {
          this.flow[e]++;
          v = this.from[e];
        } else {
          this.flow[e]--;
          v = this.to[e];
        }
      }
      sent++;
      cost += dist[sink];
    }
    return { flow: sent, cost };
  }
}
