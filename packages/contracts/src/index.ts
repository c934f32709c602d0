export * from "./errors.js";
export * from "./roles.js";
export * from "./pagination.js";
export * from "./auth.js";
export * from "./shops.js";
export * from "./members.js";
export * from "./library.js";
export * from "./recipes.js";
