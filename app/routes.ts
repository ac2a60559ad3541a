import { type RouteConfig, index, prefix, route } from "@react-router/dev/routes";

export default [
  index("routes/home.tsx"),

  // Accounts
  route("sign-in", "routes/auth/sign-in.tsx"),
  route("sign-out", "routes/auth/sign-out.ts"),
  route("auth/sso/start", "routes/auth/sso-start.ts"),
  route("auth/sso/callback", "routes/auth/sso-callback.ts"),
  route("auth/email/verify", "routes/auth/email-verify.tsx"),
  route("account", "routes/account/index.tsx"),
  route("admin/users", "routes/admin/users.tsx"),

  // Array registry
  ...prefix("registry", [index("routes/registry/overview.tsx")]),

  // Notices
  ...prefix("mailbox", [index("routes/mailbox/index.tsx"), route(":messageId", "routes/mailbox/message.tsx")]),

  // JSON API (resource routes)
  ...prefix("api", [
    route("coverage", "routes/api/coverage.ts"),
    route("ephemeris", "routes/api/ephemeris.ts"),
    route("triangles", "routes/api/triangles.ts"),
  ]),

  route("*", "routes/not-found.tsx"),
] satisfies RouteConfig;
