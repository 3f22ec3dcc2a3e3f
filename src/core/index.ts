export * from "./complex.js";
export * from "./errors.js";
export * from "./symTensor.js";
export * from "./eigen.js";
