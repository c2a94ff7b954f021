import { useEffect, useId, useState } from "react";
import {
  Form,
  Link,
  Links,
  Meta,
  NavLink,
  Outlet,
  Scripts,
  ScrollRestoration,
  useLocation,
  useRouteLoaderData,
} from "react-router";
import { getUser, hasRole, withSessions } from "~/auth/session.server";
import { unitsFor } from "~/auth/units.server";
import { UnitsSwitch } from "~/components/units-switch";
import { ErrorPage } from "~/components/error-page";
import { db, RETRY_AFTER_SECONDS, servingRequest } from "~/db.server";
import { SearchBox } from "~/components/search-box";
import { applySecurityHeaders, crossSiteRefusal, newNonce } from "~/security.server";
import { nonceContext, useNonce } from "~/utils/nonce";
import { refuseUnreadableRequest } from "~/utils/request-checks.server";
import type { Route } from "./+types/root";
import "./app.css";

export const middleware: Route.MiddlewareFunction[] = [
  async ({ request, context }, next) => {
    const nonce = newNonce();
    context.set(nonceContext, nonce);
    const response =
      crossSiteRefusal(request) ??
      refuseUnreadableRequest(request) ??
      (await servingRequest(request, () => withSessions(db, next)));
    if (response.status === 503 && !response.headers.has("Retry-After"))
      response.headers.set("Retry-After", RETRY_AFTER_SECONDS);
    applySecurityHeaders(response.headers, nonce, import.meta.env.DEV);
    return response;
  },
];

export async function loader({ request }: Route.LoaderArgs) {
  const [user, units] = await Promise.all([getUser(request), unitsFor(request)]);
  return {
    units,
    user: user && { handle: user.handle, isModerator: hasRole(user, "moderator"), isAdmin: hasRole(user, "admin") },
  };
}

export function Layout({ children }: { children: React.ReactNode }) {
  const nonce = useNonce();
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <link rel="icon" href="/favicon.svg" type="image/svg+xml" />
        <Meta />
        {/* Stylesheets come from our own origin and need no nonce; an empty one keeps hydration in step. */}
        <Links nonce="" />
      </head>
      <body className="min-h-screen bg-bay-50 font-sans text-stone-900 antialiased">
        {/* First in the tab order: past the header straight to the page's own content. */}
        <a href="#content" className="skip-link">
          Skip to content
        </a>
        <SiteHeader />
        <main id="content" tabIndex={-1} className="mx-auto w-full max-w-5xl px-4 py-6 focus:outline-none">
          {children}
        </main>
        <SiteFooter />
        <ScrollRestoration nonce={nonce} />
        <Scripts nonce={nonce} />
      </body>
    </html>
  );
}

export default function App() {
  // Marks the page as interactive; end-to-end tests wait for it before typing.
  useEffect(() => {
    document.documentElement.dataset.hydrated = "true";
  }, []);
  return <Outlet />;
}

// On a phone the links fold behind a menu button (a disclosure: aria-expanded, Escape closes, any
// navigation closes); from the md width up they sit in one row. Every link is a 44 px target.
function SiteHeader() {
  const user = useRouteLoaderData<typeof loader>("root")?.user;
  // The menu is open for the location it was opened at: any navigation closes it.
  const location = useLocation();
  const [openAt, setOpenAt] = useState<string | null>(null);
  const open = openAt === location.key;
  const setOpen = (next: boolean) => setOpenAt(next ? location.key : null);
  const menuId = useId();
  const link = ({ isActive }: { isActive: boolean }) =>
    `flex min-h-11 items-center rounded px-3 ${isActive ? "bg-bay-700 text-white" : "text-bay-50 hover:bg-bay-700"}`;
  return (
    <header className="site-header bg-bay-900 text-white">
      <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-2">
        <Link to="/" className="flex min-h-11 items-center gap-2 text-lg font-bold tracking-tight">
          <img src="/favicon.svg" alt="" width={28} height={28} />
          Bayproof
        </Link>
        <button
          type="button"
          className="ml-auto flex min-h-11 items-center gap-2 rounded border border-bay-100/60 px-3 text-sm font-semibold md:hidden"
          aria-expanded={open}
          aria-controls={menuId}
          onClick={() => setOpen(!open)}
        >
          <span aria-hidden="true">{open ? "✕" : "☰"}</span> Menu
        </button>
        <div className="order-last w-full md:order-none md:w-64">
          <SearchBox />
        </div>
        <nav
          id={menuId}
          aria-label="Main"
          onKeyDown={(e) => {
            if (e.key === "Escape" && open) setOpen(false);
          }}
          className={`${open ? "flex" : "hidden"} w-full flex-col gap-1 pb-2 text-sm font-semibold md:ml-auto md:flex md:w-auto md:flex-row md:flex-wrap md:pb-0`}
        >
          <NavLink to="/models" className={link}>
            Tools
          </NavLink>
          <NavLink to="/jobs" className={link}>
            Jobs
          </NavLink>
          <NavLink to="/bench" className={link}>
            Bench
          </NavLink>
          <NavLink to="/air" className={link}>
            Air
          </NavLink>
          {user?.isModerator && (
            <NavLink to="/review" className={link}>
              Review
            </NavLink>
          )}
          {user?.isAdmin && (
            <NavLink to="/admin/users" className={link}>
              Users
            </NavLink>
          )}
          {user?.isAdmin && (
            <NavLink to="/admin/jobs" className={link}>
              Stuck work
            </NavLink>
          )}
          {user ? (
            <>
              <NavLink to="/me/reports" className={link}>
                My reports
              </NavLink>
              <NavLink to="/account" className={link}>
                {user.handle}
              </NavLink>
              <Form method="post" action="/sign-out">
                <button
                  type="submit"
                  className="flex min-h-11 w-full items-center rounded px-3 text-bay-50 hover:bg-bay-700"
                >
                  Sign out
                </button>
              </Form>
            </>
          ) : (
            <NavLink to="/sign-in" className={link}>
              Sign in
            </NavLink>
          )}
        </nav>
      </div>
    </header>
  );
}

function SiteFooter() {
  const units = useRouteLoaderData<typeof loader>("root")?.units;
  return (
    <footer className="mx-auto max-w-5xl px-4 pb-8 pt-4 text-sm text-stone-700">
      Bayproof records what technicians report from real jobs. Follow the tool maker's instructions, local codes and
      licensed practice; wear eye and hearing protection around air tools.{" "}
      <Link to="/data" className="underline">
        Open data (CC BY 4.0)
      </Link>
      {units && <UnitsSwitch system={units.system} />}
    </footer>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
