/**
 * One timing routine for every benchmark: warm-up, then wall-clock median and minimum of several runs,
 * and the median CPU time of this process (user + system), which a busy machine disturbs less.
 */
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import { fileURLToPath } from "node:url";

export interface Timing {
  medianMs: number;
  minMs: number;
  /** Median CPU time of this process for one run (user + system), ms. */
  cpuMedianMs: number;
  runs: number;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : 0.5 * (s[mid - 1] + s[mid]);
}

/** Runs `fn` `warmup` times untimed, then `runs` times timed. */
export function time(fn: () => unknown, runs: number, warmup = 2): Timing {
  for (let i = 0; i < warmup; i++) fn();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    fn();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { medianMs: median(wall), minMs: Math.min(...wall), cpuMedianMs: median(cpu), runs };
}

/** "12.3 ms" (median) with `digits` decimals. */
export function ms(t: Timing, digits = 1): string {
  return `${t.medianMs.toFixed(digits)} ms`;
}

/** The processor's model name (from /proc/cpuinfo where there is one). */
export function cpuModel(): string {
  try {
    const m = /model name\s*:\s*(.+)/.exec(readFileSync("/proc/cpuinfo", "utf8"));
    if (m) return m[1].trim();
  } catch {
    // not Linux: the os module's name below
  }
  return cpus()[0]?.model ?? "unknown";
}

/** "AMD EPYC …, 2 cores, load average 1.2, Node v20.20.2": the line each section states its figures on. */
export function machine(): string {
  return `${cpuModel()}, ${cpus().length} cores, load average ${loadavg()[0].toFixed(1)}, Node ${process.version}`;
}

/**
 * Writes one section of docs/benchmarks.md, between `<!-- bench:NAME -->` and `<!-- /bench:NAME -->`,
 * keeping the other sections (the engine, the load test and the browser benchmark each write their own).
 */
export function writeBenchmarkSection(name: string, markdown: string): string {
  const path = fileURLToPath(new URL("../docs/benchmarks.md", import.meta.url));
  const open = `<!-- bench:${name} -->`;
  const close = `<!-- /bench:${name} -->`;
  const block = `${open}\n${markdown.trim()}\n${close}`;
  const current = existsSync(path) ? readFileSync(path, "utf8") : "# Benchmarks\n";
  const at = current.indexOf(open);
  const end = current.indexOf(close);
  const next =
    at >= 0 && end > at
      ? `${current.slice(0, at)}${block}${current.slice(end + close.length)}`
      : `${current.trimEnd()}\n\n${block}\n`;
  writeFileSync(path, next.endsWith("\n") ? next : `${next}\n`);
  return path;
}
