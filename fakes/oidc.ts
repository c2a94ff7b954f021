// A local OpenID Connect provider for sign-in without the internet, built on oauth2-mock-server.
// Its /authorize first shows a tiny page to pick a demo account (or a brand-new person); the
// tokens it then issues carry that account's subject and e-mail.
import { randomBytes } from "node:crypto";
import http from "node:http";
import { OAuth2Server } from "oauth2-mock-server";

export interface DemoAccount {
  subject: string;
  email: string;
  label: string;
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function pickerPage(url: URL, accounts: DemoAccount[]) {
  const link = (account: string) => {
    const u = new URL(url);
    u.searchParams.set("account", account);
    return esc(u.pathname + u.search);
  };
  const refuse = new URL(url.searchParams.get("redirect_uri") ?? "about:blank");
  refuse.searchParams.set("error", "access_denied");
  refuse.searchParams.set("error_description", "The person declined to sign in");
  if (url.searchParams.get("state")) refuse.searchParams.set("state", url.searchParams.get("state")!);
  const items = accounts
    .map((a) => `<li><a href="${link(a.subject)}">${esc(a.label)}<small>${esc(a.email)}</small></a></li>`)
    .join("");
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Demo ID — choose an account</title>
<style>body{font:16px system-ui,sans-serif;max-width:34rem;margin:2rem auto;padding:0 1rem;color:#222}
h1{font-size:1.3rem}ul{list-style:none;padding:0}li a{display:block;padding:.75rem 1rem;margin:.4rem 0;border:1px solid #bbb;border-radius:.4rem;color:#14302a;text-decoration:none}
li a:hover{background:#eef5f3}small{display:block;color:#666}.note{color:#666;font-size:.9rem}</style></head>
<body><h1>Demo ID (local stand-in for a sign-in provider)</h1>
<p class="note">Pick who you are. Nothing here is checked: this provider exists only on this machine.</p>
<ul>${items}<li><a href="${link("new")}">A new technician<small>creates a fresh account</small></a></li></ul>
<p><a href="${esc(refuse.toString())}">Decline</a></p></body></html>`;
}

export async function startOidcProvider({ port, accounts }: { port: number; accounts: DemoAccount[] }) {
  const oauth = new OAuth2Server();
  await oauth.issuer.keys.generate("RS256");
  const base = `http://127.0.0.1:${port}`;
  oauth.issuer.url = base;
  const service = oauth.service;
  const byCode = new Map<string, DemoAccount>();

  service.on("beforeAuthorizeRedirect", (redirect: { url: URL }, req: { query: Record<string, unknown> }) => {
    const code = redirect.url.searchParams.get("code");
    const chosen = typeof req.query.account === "string" ? req.query.account : "";
    let account = accounts.find((a) => a.subject === chosen);
    if (chosen === "new") {
      const id = randomBytes(4).toString("hex");
      account = { subject: `new-${id}`, email: `new-${id}@demo.bayproof.test`, label: `New technician ${id}` };
    }
    if (code && account) byCode.set(code, account);
  });
  service.on(
    "beforeTokenSigning",
    (token: { payload: Record<string, unknown> }, req: { body?: Record<string, unknown> }) => {
      const code = req.body?.code;
      const account = typeof code === "string" ? byCode.get(code) : undefined;
      if (!account) return;
      Object.assign(token.payload, {
        sub: account.subject,
        email: account.email,
        email_verified: true,
        name: account.label,
      });
    },
  );

  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", base);
    if (url.pathname === "/favicon.ico") {
      res.writeHead(204).end();
      return;
    }
    if (req.method === "GET" && url.pathname === "/authorize") {
      const account = url.searchParams.get("account");
      if (!account) {
        res.writeHead(200, { "Content-Type": "text/html; charset=utf-8" }).end(pickerPage(url, accounts));
        return;
      }
      if (account !== "new" && !accounts.some((a) => a.subject === account)) {
        res.writeHead(400, { "Content-Type": "text/plain" }).end("unknown demo account");
        return;
      }
    }
    service.requestHandler(req, res);
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  return {
    url: base,
    stop: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
