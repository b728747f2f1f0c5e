/**
 * The design advisor: from a requirement (attenuation at a field, the space inside, the
 * constraints) to the designs the shop can make that meet it, their Pareto front on price, mass
 * and attenuation, and one recommendation. Pure TypeScript, no I/O.
 */
export * from "./space";
export * from "./bounds";
export * from "./pareto";
export * from "./search";
export { money, marginWords } from "./explain";
export * from "./problem";
