/**
 * The database going away and coming back, with the app running: the built app reaches PostgreSQL
 * through a TCP relay in this test that can refuse connections (down) or swallow them (stuck).
 * Pages answer a kind 503, the API a 503 JSON, both with Retry-After; it recovers without a restart.
 */
import { connect, createServer, type Server, type Socket } from "node:net";
import { type BuiltApp, startBuiltApp } from "@test/built-app";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

type Mode = "up" | "stuck";

/** A relay to PostgreSQL on `port`; `close()` takes it down (and cuts every connection), `open()` back up. */
function relay(target: URL) {
  let server: Server | null = null;
  let mode: Mode = "up";
  const sockets = new Set<Socket>();
  let port = 0;
  const open = (m: Mode = "up") =>
    new Promise<number>((resolve) => {
      mode = m;
      server = createServer((client) => {
        sockets.add(client);
        client.on("close", () => sockets.delete(client));
        client.on("error", () => undefined);
        if (mode === "stuck") return; // accepted, never answered
        const upstream = createConnectionTo(target);
        sockets.add(upstream);
        upstream.on("close", () => sockets.delete(upstream));
        upstream.on("error", () => client.destroy());
        client.on("error", () => upstream.destroy());
        client.pipe(upstream).pipe(client);
      });
      server.listen(port, "127.0.0.1", () => {
        port = (server!.address() as { port: number }).port;
        resolve(port);
      });
    });
  const close = () =>
    new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      sockets.clear();
      if (!server) return resolve();
      server.close(() => resolve());
      server = null;
    });
  return { open, close };
}

function createConnectionTo(target: URL) {
  return connect(Number(target.port), target.hostname);
}

const real = new URL(process.env.DATABASE_URL!);
const db = relay(real);
const relayPort = await db.open();
const viaRelay = new URL(real);
viaRelay.port = String(relayPort);
// Before anything opens the pool: the app (and this file's helpers) reach the database through the relay.
process.env.DATABASE_URL = viaRelay.toString();
process.env.DB_CONNECT_TIMEOUT_S = "1";

const { testDb } = await import("@test/routes");
const { ensureUser, seedDemoScenario } = await import("~/db/seed/factories.server");
const { createSession } = await import("~/services/auth/sessions.server");

let app: BuiltApp;
let cookie: string;

beforeAll(async () => {
  await seedDemoScenario(testDb());
  const user = await ensureUser(testDb(), { email: "outage@lumbre.example", name: "Outage Test", roles: ["proposer"] });
  cookie = `fd_session=${(await createSession(testDb(), user.id, { method: "sso" })).token}`;
  app = await startBuiltApp();
});
afterAll(async () => {
  await app?.close();
  await db.close();
});

const coverage = () =>
  fetch(`${app.url}/api/ephemeris`, {
    method: "POST",
    headers: { Cookie: cookie, "Content-Type": "application/json" },
    body: JSON.stringify({ site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 }, date: "2027-03-15" }),
  });

describe("while the database is away", () => {
  it("answers pages with a kind 503 and the API with 503 JSON, then recovers without a restart", async () => {
    expect((await fetch(`${app.url}/registry`)).status).toBe(200);
    expect((await coverage()).status).toBe(200);

    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    await db.close();
    for (const path of ["/", "/registry", "/account", "/mailbox"]) {
      const page = await fetch(`${app.url}${path}`, { headers: { Cookie: cookie } });
      expect(page.status, path).toBe(503);
      expect(page.headers.get("Retry-After")).toBe("30");
      expect(page.headers.get("Content-Type")).toMatch(/text\/html/);
      expect(await page.text()).toContain("Fringe Docket is catching its breath");
    }
    const api = await coverage();
    expect(api.status).toBe(503);
    expect(api.headers.get("Retry-After")).toBe("30");
    expect(api.headers.get("Content-Type")).toMatch(/application\/json/);
    expect((await api.json()).error).toMatch(/cannot reach its database/);
    expect(warn.mock.calls.some((c) => String(c[0]).startsWith("[database-unavailable]"))).toBe(true);

    await db.open("up");
    expect((await fetch(`${app.url}/registry`)).status).toBe(200);
    expect((await coverage()).status).toBe(200);
  });

  it("answers 503 after the connect timeout when the database accepts connections but never answers", async () => {
    vi.spyOn(console, "warn").mockImplementation(() => {});
    await db.close();
    await db.open("stuck");
    const page = await fetch(`${app.url}/registry`, { signal: AbortSignal.timeout(15_000) });
    expect(page.status).toBe(503);
    await db.close();
    await db.open("up");
    expect((await fetch(`${app.url}/registry`)).status).toBe(200);
  });
});
