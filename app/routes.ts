import { type RouteConfig, index, route } from "@react-router/dev/routes";

export default [
  index("routes/_index.tsx"),
  route("models", "routes/models._index.tsx"),
  route("models/:slug", "routes/models.$slug.tsx"),
  route("jobs", "routes/jobs._index.tsx"),
  route("jobs/:slug", "routes/jobs.$slug.tsx"),
  route("*", "routes/$.tsx"),
] satisfies RouteConfig;
