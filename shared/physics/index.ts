export * from "./materials";
export * from "./permeability";
export * from "./exact";
export * from "./thin";
export * from "./saturation";
export * from "./predict";
export { scaledBessel01, besselI, besselK } from "./bessel";
export { Complex } from "./complex";
