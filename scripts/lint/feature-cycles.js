// ESLint rule "bayproof/no-feature-cycle": two feature folders of app/ must not import each other,
// directly or round a longer loop. import-x/no-cycle sees loops of files; this sees loops of folders
// (jobs/worker.server → moderation/mail.server while moderation/decide.server → jobs/queue.server is
// no file cycle, but it is two features that each need the other). A shared need moves down into a
// module of its own. The folder graph is read from the files on disk once per run; the file being
// linted is judged by its own imports.
import fs from "node:fs";
import path from "node:path";

/** Folders of app/ that are layers, not features (their rules are in eslint.config.js). */
const NOT_FEATURES = new Set(["routes", "components", "utils", "domain"]);
const IMPORT_PATTERN = /(?:^|[\s;])(?:import|export)\s[^;]*?from\s*["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)/g;

/** @param {string} appDir @param {string} file */
function featureOf(appDir, file) {
  const rel = path.relative(appDir, file);
  if (rel.startsWith("..") || path.isAbsolute(rel)) return null;
  const parts = rel.split(path.sep);
  return parts.length > 1 && !NOT_FEATURES.has(parts[0]) ? parts[0] : null;
}

/** @param {string} dir @returns {string[]} */
function sourceFiles(dir) {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.tsx?$/.test(entry.name) && !entry.name.endsWith(".d.ts") ? [full] : [];
  });
}

/** Feature → the features it imports, each with one file that does it. */
function buildGraph(appDir, resolve) {
  /** @type {Map<string, Map<string, string>>} */
  const graph = new Map();
  for (const file of sourceFiles(appDir)) {
    const from = featureOf(appDir, file);
    if (!from) continue;
    const text = fs.readFileSync(file, "utf8");
    for (const match of text.matchAll(IMPORT_PATTERN)) {
      const target = resolve(match[1] ?? match[2], file);
      const to = target && featureOf(appDir, target);
      if (!to || to === from) continue;
      if (!graph.has(from)) graph.set(from, new Map());
      const edges = graph.get(from);
      if (!edges.has(to)) edges.set(to, path.relative(appDir, file));
    }
  }
  return graph;
}

/** The shortest path of features from `start` to `goal`, or null. */
function findPath(graph, start, goal) {
  const previous = new Map([[start, null]]);
  const queue = [start];
  while (queue.length > 0) {
    const node = queue.shift();
    if (node === goal) {
      const route = [];
      for (let at = goal; at !== null; at = previous.get(at)) route.unshift(at);
      return route;
    }
    for (const next of graph.get(node)?.keys() ?? []) {
      if (!previous.has(next)) {
        previous.set(next, node);
        queue.push(next);
      }
    }
  }
  return null;
}

/**
 * @param {{ appDir: string, resolve: (source: string, file: string) => string | null }} options
 * @returns {import("eslint").Rule.RuleModule}
 */
export function featureCycles({ appDir, resolve }) {
  let graph = null;
  return {
    meta: {
      type: "problem",
      docs: { description: "Feature folders of app/ must not import each other in a circle" },
      messages: {
        cycle:
          "{{from}} imports {{to}}, and {{to}} already reaches {{from}} ({{loop}}): move the shared need into a module of its own.",
      },
      schema: [],
    },
    create(context) {
      const file = context.physicalFilename;
      const from = featureOf(appDir, file);
      if (!from) return {};
      graph ??= buildGraph(appDir, resolve);
      function check(node) {
        if (typeof node.source?.value !== "string") return;
        const target = resolve(node.source.value, file);
        const to = target && featureOf(appDir, target);
        if (!to || to === from) return;
        const back = findPath(graph, to, from);
        if (back)
          context.report({
            node: node.source,
            messageId: "cycle",
            data: { from, to, loop: [from, ...back].join(" → ") },
          });
      }
      return {
        ImportDeclaration: check,
        ExportNamedDeclaration: check,
        ExportAllDeclaration: check,
        ImportExpression: check,
      };
    },
  };
}
