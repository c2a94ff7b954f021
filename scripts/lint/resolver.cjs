// Module resolution for eslint-plugin-boundaries (which loads resolvers by name, in CommonJS):
// the same rules as TypeScript's, read from tsconfig.json, so "~/stats" and "../../db/schema"
// land on the files the compiler sees. eslint-plugin-import-x uses its own resolver with the
// same options (eslint.config.js).
const path = require("node:path");
const { isBuiltin } = require("node:module");
const { ResolverFactory } = require("unrs-resolver");

const options = {
  tsconfig: { configFile: path.join(__dirname, "..", "..", "tsconfig.json") },
  extensions: [".ts", ".tsx", ".js", ".mjs", ".cjs", ".json"],
  extensionAlias: { ".js": [".ts", ".tsx", ".js"] },
  conditionNames: ["types", "import", "require", "default"],
  mainFields: ["types", "module", "main"],
};
const resolver = new ResolverFactory(options);

module.exports = {
  interfaceVersion: 2,
  options,
  resolve(source, file) {
    if (isBuiltin(source)) return { found: true, path: null };
    try {
      const resolved = resolver.sync(path.dirname(file), source);
      if (resolved.path) return { found: true, path: resolved.path };
    } catch {
      // Not found: the plugin reports the import as unresolved.
    }
    return { found: false };
  },
};
