export * from "./types";
export * from "./fit";
export * from "./calibrate";
export * from "./control-chart";
export { median, medianAbs, robustSigma, sampleSd, normalQuantile } from "./stats";
