import { index, prefix, type RouteConfig, route } from "@react-router/dev/routes";

export default [
  index("routes/home/index.tsx"),

  // Accounts
  route("sign-in", "routes/auth/sign-in.tsx"),
  route("sign-out", "routes/auth/sign-out.ts"),
  route("auth/sso/start", "routes/auth/sso-start.ts"),
  route("auth/sso/callback", "routes/auth/sso-callback.ts"),
  route("auth/email/verify", "routes/auth/email-verify.tsx"),
  route("account", "routes/account/index.tsx"),
  route("admin/users", "routes/admin/users.tsx"),

  // Array registry
  ...prefix("registry", [
    index("routes/registry/overview.tsx"),
    route("sites/new", "routes/registry/sites/new.tsx"),
    route("sites/:siteId/edit", "routes/registry/sites/edit.tsx"),
    route("stations/new", "routes/registry/stations/new.tsx"),
    route("stations/:stationId", "routes/registry/stations/station.tsx"),
    route("stations/:stationId/edit", "routes/registry/stations/edit.tsx"),
    route("configurations/new", "routes/registry/configurations/new.tsx"),
    route("configurations/:configurationId/edit", "routes/registry/configurations/edit.tsx"),
    route("instruments/new", "routes/registry/instruments/new.tsx"),
    route("instruments/:instrumentId/edit", "routes/registry/instruments/edit.tsx"),
    route("instruments/:instrumentId/bands/new", "routes/registry/bands/new.tsx"),
    route("bands/:bandId/edit", "routes/registry/bands/edit.tsx"),
    route("import", "routes/registry/import.tsx"),
    route("export/:file", "routes/registry/export.ts"),
  ]),

  // Sketchpad and Triangle finder
  route("sketchpad", "routes/sketch/sketchpad.tsx"),
  route("triangles", "routes/sketch/triangles.tsx"),

  // Cycles
  ...prefix("cycles", [
    index("routes/cycles/index.tsx"),
    route("new", "routes/cycles/new.tsx"),
    route(":cycleId", "routes/cycles/cycle.tsx"),
    route(":cycleId/edit", "routes/cycles/edit.tsx"),
    route(":cycleId/assignments", "routes/cycles/assignments.tsx"),
  ]),

  // Review desk
  ...prefix("review", [
    index("routes/review/index.tsx"),
    route("cycles/:cycleId/conflicts", "routes/review/conflicts.tsx"),
    route("proposals/:proposalId", "routes/review/proposal.tsx"),
    route("proposals/:proposalId/science-case", "routes/review/science-case.ts"),
  ]),

  // Ranking board
  ...prefix("board", [index("routes/board/index.tsx"), route(":cycleId", "routes/board/cycle.tsx")]),

  // My targets
  ...prefix("targets", [
    index("routes/targets/index.tsx"),
    route("import", "routes/targets/import.tsx"),
    route("export.csv", "routes/targets/export.ts"),
    route(":targetId", "routes/targets/edit.tsx"),
  ]),

  // Proposals
  ...prefix("proposals", [
    index("routes/proposals/list.tsx"),
    route("new", "routes/proposals/new.tsx"),
    route(":proposalId", "routes/proposals/editor/route.tsx"),
    route(":proposalId/targets/:targetId", "routes/proposals/target.tsx"),
    route(":proposalId/feasibility", "routes/proposals/feasibility.tsx"),
    route(":proposalId/science-case", "routes/proposals/science-case.ts"),
    route(":proposalId/versions/:version", "routes/proposals/version.tsx"),
  ]),

  // Star catalogue: Calibrator shortlists
  ...prefix("catalogue", [
    route("calibrators", "routes/catalogue/shortlist.tsx"),
    route("proposals/:proposalId/targets/:targetId/calibrators", "routes/catalogue/proposal-shortlist.tsx"),
  ]),

  // Night builder
  ...prefix("nights", [
    index("routes/nights/calendar.tsx"),
    route(":date", "routes/nights/night.tsx"),
    route(":date/export/:file", "routes/nights/export.ts"),
  ]),

  // Notices
  ...prefix("mailbox", [index("routes/mailbox/index.tsx"), route(":messageId", "routes/mailbox/message.tsx")]),

  // JSON API (resource routes)
  ...prefix("api", [
    route("coverage", "routes/api/coverage.ts"),
    route("ephemeris", "routes/api/ephemeris.ts"),
    route("triangles", "routes/api/triangles.ts"),
    route("resolve", "routes/api/resolve.ts"),
    route("calibrators", "routes/api/calibrators.ts"),
    route("stars", "routes/api/stars.ts"),
    route("plan", "routes/api/plan.ts"),
    route("nights/:date/plan", "routes/api/night-plan.ts"),
    route("rank", "routes/api/rank.ts"),
    route("cycles/:cycleId/board", "routes/api/cycle-board.ts"),
    route("imaging/jobs", "routes/api/imaging-jobs.ts"),
    route("imaging/jobs/:id", "routes/api/imaging-job.ts"),
    route("imaging/jobs/:id/cancel", "routes/api/imaging-job-cancel.ts"),
    route("imaging/jobs/:id/oifits", "routes/api/imaging-job-oifits.ts"),
  ]),

  route("*", "routes/not-found.tsx"),
] satisfies RouteConfig;
