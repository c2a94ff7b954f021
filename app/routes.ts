import { type RouteConfig, index, route } from "@react-router/dev/routes";

export default [
  index("routes/_index.tsx"),
  route("models", "routes/models._index.tsx"),
  route("models/:slug", "routes/models.$slug.tsx"),
  route("jobs", "routes/jobs._index.tsx"),
  route("jobs/:slug", "routes/jobs.$slug.tsx"),
  route("air", "routes/air.tsx"),
  route("sign-in", "routes/sign-in.tsx"),
  route("sign-in/link", "routes/sign-in.link.tsx"),
  route("sign-out", "routes/sign-out.tsx"),
  route("auth/:provider", "routes/auth.$provider.tsx"),
  route("auth/:provider/callback", "routes/auth.$provider.callback.tsx"),
  route("account", "routes/account.tsx"),
  route("admin/users", "routes/admin.users.tsx"),
  route("dev/mail", "routes/dev.mail.tsx"),
  route("dev/mail/:id", "routes/dev.mail.$id.tsx"),
  route("*", "routes/$.tsx"),
] satisfies RouteConfig;
