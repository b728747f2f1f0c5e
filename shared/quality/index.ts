// Quality: sampling plans (ISO 2859-1 / ANSI/ASQ Z1.4), switching between normal, tightened and
// reduced inspection, the measurement arithmetic and the certificate digest. Pure: no I/O.
export * from "./sampling-tables";
export * from "./sampling-plan";
export * from "./switching";
export * from "./measurement";
export * from "./digest";
export * from "./instruments";
