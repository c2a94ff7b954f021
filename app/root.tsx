import { ErrorPage } from "~/components/error-page";
import { Link, Links, Meta, NavLink, Outlet, Scripts, ScrollRestoration } from "react-router";
import type { Route } from "./+types/root";
import "./app.css";

export function Layout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <link rel="icon" href="/favicon.svg" type="image/svg+xml" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen bg-bay-50 font-sans text-stone-900 antialiased">
        <SiteHeader />
        <main className="mx-auto w-full max-w-5xl px-4 py-6">{children}</main>
        <SiteFooter />
        <ScrollRestoration />
        <Scripts />
      </body>
    </html>
  );
}

export default function App() {
  return <Outlet />;
}

function SiteHeader() {
  const link = ({ isActive }: { isActive: boolean }) =>
    `rounded px-3 py-2 ${isActive ? "bg-bay-700 text-white" : "text-bay-50 hover:bg-bay-700"}`;
  return (
    <header className="bg-bay-900 text-white">
      <div className="mx-auto flex max-w-5xl flex-wrap items-center justify-between gap-2 px-4 py-3">
        <Link to="/" className="flex items-center gap-2 text-lg font-bold tracking-tight">
          <img src="/favicon.svg" alt="" width={28} height={28} />
          Bayproof
        </Link>
        <nav aria-label="Main" className="flex gap-1 text-sm font-semibold">
          <NavLink to="/models" className={link}>Tools</NavLink>
          <NavLink to="/jobs" className={link}>Jobs</NavLink>
        </nav>
      </div>
    </header>
  );
}

function SiteFooter() {
  return (
    <footer className="mx-auto max-w-5xl px-4 pb-8 pt-4 text-xs text-stone-600">
      Bayproof records what technicians report from real jobs. Follow the tool maker's instructions, local codes and
      licensed practice; wear eye and hearing protection around air tools.
    </footer>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
