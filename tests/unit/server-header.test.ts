// server.js is plain JavaScript and cannot import the app's constant: the two must agree.
import { readFileSync } from "node:fs";
import { expect, it } from "vitest";
import { CLIENT_ADDRESS_HEADER } from "../../app/utils/client-address.server";

it("server.js sets the client-address header the app reads", () => {
  const server = readFileSync(new URL("../../server.js", import.meta.url), "utf8");
  expect(server).toContain(`const CLIENT_ADDRESS_HEADER = "${CLIENT_ADDRESS_HEADER}";`);
});
