import pg from "pg";
import { isDatabaseUnavailable } from "./connection-errors.js";
import { Sequelize, type Transaction } from "sequelize";
import { initUserModel } from "../modules/users/user.model.js";
import { initShopModel } from "../modules/shops/shop.model.js";
import { initMembershipModel } from "../modules/shops/membership.model.js";
import { initRevokedSessionModel } from "../modules/auth/revoked-session.model.js";
import { initMaterialModel } from "../modules/materials/material.model.js";
import { initCutterModel } from "../modules/cutters/cutter.model.js";
import { associateMachineModels, initMachineModel } from "../modules/machines/machine.model.js";
import { initMachineModeModel } from "../modules/machines/machine-mode.model.js";
import { initAssemblyModel } from "../modules/assemblies/assembly.model.js";
import { initRecipeModels } from "../modules/recipes/recipe.model.js";
import { initCutLogModels } from "../modules/cut-logs/cut-log.model.js";
import { initLadderModel } from "../modules/ladders/ladder.model.js";
import { initVibrationModels } from "../modules/vibration/vibration.models.js";

// BIGINT counts (COUNT(*)) come back as strings by default; our counts fit in a JS number.
pg.types.setTypeParser(pg.types.builtins.INT8, (value: string) => Number.parseInt(value, 10));

let instance: Sequelize | undefined;

/** Creates the process's Sequelize instance and registers every model on it. */
export function connectDatabase(databaseUrl: string): Sequelize {
  if (instance) throw new Error("connectDatabase() was called twice in one process");
  instance = new Sequelize(databaseUrl, {
    dialect: "postgres",
    dialectModule: pg,
    logging: false,
    // Fail fast when PostgreSQL is away: a connection attempt gives up after 4 s and a request
    // waits at most 5 s for a pooled connection, then gets a 503 (error middleware). Broken
    // connections are dropped from the pool, so it recovers by itself when the server is back.
    pool: { max: 10, min: 0, acquire: 5_000, idle: 10_000 },
    dialectOptions: { connectionTimeoutMillis: 4_000 },
    define: { underscored: true },
  });
  // When the server ends a session while a statement runs (shutdown, restart, a terminated
  // backend), node-postgres reports it to that statement only and Sequelize would put the dead
  // connection back in the pool for the next request. Marked invalid, the pool drops it instead.
  // The statement's own error can reach Sequelize (which then releases the connection) before the
  // socket's "end" event, so a failed statement that says the session is gone marks it too, in a
  // handler attached before Sequelize's own.
  instance.addHook("afterConnect", (connection) => {
    const client = connection as pg.Client & { _invalid?: boolean };
    client.once("end", () => {
      client._invalid = true;
    });
    const query = client.query.bind(client) as (...args: unknown[]) => unknown;
    (client as unknown as { query: (...args: unknown[]) => unknown }).query = (...args: unknown[]) => {
      const last = args.length - 1;
      const callback = args[last];
      if (typeof callback === "function") {
        // Sequelize passes a callback: mark the session before it hears of the error.
        args[last] = (error: unknown, ...rest: unknown[]) => {
          if (error && isDatabaseUnavailable(error)) client._invalid = true;
          return (callback as (...a: unknown[]) => unknown)(error, ...rest);
        };
        return query(...args);
      }
      const result = query(...args);
      if (result && typeof (result as Promise<unknown>).then === "function") {
        (result as Promise<unknown>).catch((error: unknown) => {
          if (isDatabaseUnavailable(error)) client._invalid = true;
        });
      }
      return result;
    };
  });
  initUserModel(instance);
  initShopModel(instance);
  initMembershipModel(instance);
  initRevokedSessionModel(instance);
  initMaterialModel(instance);
  initCutterModel(instance);
  initMachineModel(instance);
  initMachineModeModel(instance);
  associateMachineModels();
  initAssemblyModel(instance);
  initRecipeModels(instance);
  initCutLogModels(instance);
  initLadderModel(instance);
  initVibrationModels(instance);
  return instance;
}

export function getSequelize(): Sequelize {
  if (!instance) throw new Error("The database is not connected yet (call connectDatabase first)");
  return instance;
}

export async function closeDatabase(): Promise<void> {
  const current = instance;
  instance = undefined;
  await current?.close();
}

/** Opaque transaction handle passed from services to repositories. */
export type Tx = Transaction;

/** Runs `work` in one transaction: committed when it resolves, rolled back when it throws. */
export function inTransaction<T>(work: (tx: Tx) => Promise<T>): Promise<T> {
  return getSequelize().transaction((tx) => work(tx));
}
