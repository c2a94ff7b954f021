import { Link } from "react-router";
import { ErrorPage } from "~/components/error-page";
import { Card } from "~/components/ui";
import { getMessage } from "~/dev/mail.server";
import type { Route } from "./+types/dev.mail.$id";

export async function loader({ params }: Route.LoaderArgs) {
  return { message: await getMessage(params.id) };
}

export default function DevMailMessage({ loaderData }: Route.ComponentProps) {
  const m = loaderData.message;
  // Make links in the plain-text body clickable; nothing else is interpreted.
  const parts = m.text.split(/(https?:\/\/\S+)/g);
  return (
    <Card as="article" className="space-y-3">
      <p>
        <Link to="/dev/mail" className="text-bay-700 underline">
          ← All local mail
        </Link>
      </p>
      <h1 className="text-xl font-bold">{m.subject}</h1>
      <p className="text-sm text-stone-600">
        From {m.from} to {m.to} · {m.date}
      </p>
      <pre className="whitespace-pre-wrap break-all font-sans">
        {parts.map((p, i) =>
          /^https?:\/\//.test(p) ? (
            <a key={i} href={p} className="text-bay-700 underline">
              {p}
            </a>
          ) : (
            p
          ),
        )}
      </pre>
    </Card>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}

export function meta() {
  return [{ title: "A sent message — Bayproof (development)" }];
}
