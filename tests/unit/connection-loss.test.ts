// Which errors mean the database connection was lost, and which queries may run again.
import { CompiledQuery, Kysely, PostgresDialect } from "kysely";
import { describe, expect, it } from "vitest";
import { isConnectionError, isReadQuery } from "../../db/connection-loss";

const pgError = (code: string, message = "") => Object.assign(new Error(message), { code });

describe("isConnectionError", () => {
  it("knows a lost or refused connection", () => {
    // Codes: PostgreSQL's error codes appendix, class 08 and 57P (published); node's errno names (published).
    for (const code of ["57P01", "57P02", "57P03", "08006", "08003", "ECONNRESET", "ECONNREFUSED", "EPIPE"]) {
      expect(isConnectionError(pgError(code)), code).toBe(true);
    }
    expect(isConnectionError(new Error("Connection terminated unexpectedly"))).toBe(true);
    expect(isConnectionError(new Error("Connection terminated"))).toBe(true);
    expect(isConnectionError(new Error("Client has encountered a connection error and is not queryable"))).toBe(true);
    expect(isConnectionError(new AggregateError([pgError("ECONNREFUSED")], "connect failed"))).toBe(true);
  });

  it("leaves every other error alone", () => {
    // 22021 invalid byte sequence (NUL), 22003 out of range, 23514 check violation, 40001 serialization failure.
    for (const code of ["22021", "22003", "23514", "23505", "40001", "42P01"]) {
      expect(isConnectionError(pgError(code, "Connection terminated in the message is not enough")), code).toBe(false);
    }
    expect(isConnectionError(new Error("something else"))).toBe(false);
    expect(isConnectionError("Connection terminated")).toBe(false);
    expect(isConnectionError(null)).toBe(false);
  });
});

describe("isReadQuery", () => {
  // Compiling needs no connection.
  const db = new Kysely<{ t: { id: number } }>({ dialect: new PostgresDialect({ pool: {} as never }) });

  it("runs a SELECT again, never a write", () => {
    expect(isReadQuery(db.selectFrom("t").select("id").compile())).toBe(true);
    expect(isReadQuery(CompiledQuery.raw("select 1"))).toBe(true);
    expect(isReadQuery(db.insertInto("t").values({ id: 1 }).compile())).toBe(false);
    expect(isReadQuery(db.updateTable("t").set({ id: 2 }).compile())).toBe(false);
    expect(isReadQuery(db.deleteFrom("t").compile())).toBe(false);
    expect(isReadQuery(CompiledQuery.raw("with x as (delete from t returning id) select * from x"))).toBe(false);
    expect(isReadQuery(CompiledQuery.raw("select 1; delete from t"))).toBe(false);
  });
});
