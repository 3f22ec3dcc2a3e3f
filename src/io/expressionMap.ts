/**
 * Expression maps at the edge: the user's `virtual.x`, `virtual.y` (mathjs expressions of the
 * physical x, y in metres) are parsed, differentiated symbolically with mathjs `derivative`, and
 * compiled ONCE into a plain JavaScript function by walking the node tree against a whitelist
 * (numbers; x, y, pi, e; + − × ÷ ^ and unary minus; named math functions). Nothing else can reach
 * the generated code, so a design cannot run code of its own.
 *
 * mathjs cannot differentiate atan2, so each atan2(u, v) is lifted into an auxiliary value t
 * with the chain rule dt = (v du − u dv)/(u² + v²).
 */
import { InputError } from "../core/errors.js";
import type { CompiledMap } from "../field/transformSpec.js";
import { getMath } from "./mathjs.js";

/** Functions a map may use, with the JavaScript each compiles to. */
const FUNCTIONS: Record<string, (a: string[]) => string> = {
  sin: (a) => `Math.sin(${a[0]})`, cos: (a) => `Math.cos(${a[0]})`, tan: (a) => `Math.tan(${a[0]})`,
  asin: (a) => `Math.asin(${a[0]})`, acos: (a) => `Math.acos(${a[0]})`, atan: (a) => `Math.atan(${a[0]})`,
  sinh: (a) => `Math.sinh(${a[0]})`, cosh: (a) => `Math.cosh(${a[0]})`, tanh: (a) => `Math.tanh(${a[0]})`,
  sec: (a) => `(1 / Math.cos(${a[0]}))`, csc: (a) => `(1 / Math.sin(${a[0]}))`, cot: (a) => `(1 / Math.tan(${a[0]}))`,
  sech: (a) => `(1 / Math.cosh(${a[0]}))`, csch: (a) => `(1 / Math.sinh(${a[0]}))`, coth: (a) => `(1 / Math.tanh(${a[0]}))`,
  exp: (a) => `Math.exp(${a[0]})`, log: (a) => `Math.log(${a[0]})`, log10: (a) => `Math.log10(${a[0]})`,
  log2: (a) => `Math.log2(${a[0]})`,
  sqrt: (a) => `Math.sqrt(${a[0]})`, cbrt: (a) => `Math.cbrt(${a[0]})`, abs: (a) => `Math.abs(${a[0]})`,
  sign: (a) => `Math.sign(${a[0]})`, square: (a) => `((${a[0]}) * (${a[0]}))`, cube: (a) => `Math.pow(${a[0]}, 3)`,
  pow: (a) => `Math.pow(${a[0]}, ${a[1]})`,
  // checked here, then lifted out before differentiation (see `lift`)
  atan2: (a) => `Math.atan2(${a[0]}, ${a[1]})`,
};
const ARITY: Record<string, number> = { pow: 2, atan2: 2, max: 2, min: 2 };
const OPERATORS: Record<string, string> = { add: "+", subtract: "-", multiply: "*", divide: "/" };
const CONSTANTS: Record<string, string> = { pi: "Math.PI", e: "Math.E", x: "x", y: "y" };

/** Names the user may write, for messages. */
export const EXPRESSION_FUNCTIONS = Object.keys(FUNCTIONS).sort();

class Unusable extends Error {}

/** Longest expression accepted, in characters (a map is a formula, not a program). */
export const MAX_EXPRESSION_LENGTH = 2000;
/** Deepest nesting of parentheses and function calls accepted. */
export const MAX_EXPRESSION_DEPTH = 60;

/** An expression shortened for messages: at most 60 characters, on one line. */
export function clipExpression(text: string): string {
  const one = text.replace(/\s+/g, " ");
  return one.length > 60 ? `${one.slice(0, 57)}…` : one;
}

/** Refuse expressions too long or too deeply nested to be formulas, before mathjs recurses through them. */
function checkSize(text: string): void {
  if (text.length > MAX_EXPRESSION_LENGTH) {
    throw new Unusable(`${text.length} characters; expected at most ${MAX_EXPRESSION_LENGTH}`);
  }
  let depth = 0, deepest = 0;
  for (let k = 0; k < text.length; k++) {
    const ch = text[k];
    if (ch === "(" || ch === "[") deepest = Math.max(deepest, ++depth);
    else if (ch === ")" || ch === "]") depth--;
  }
  if (deepest > MAX_EXPRESSION_DEPTH) {
    throw new Unusable(`parentheses nested ${deepest} deep; expected at most ${MAX_EXPRESSION_DEPTH}`);
  }
}

/** JavaScript for a whitelisted mathjs node; throws Unusable for anything else. */
function toJs(node: any, symbols: Record<string, string> = CONSTANTS, fns: Record<string, (a: string[]) => string> = FUNCTIONS): string {
  const sub = (n: any): string => toJs(n, symbols, fns);
  switch (node.type) {
    case "ConstantNode": {
      if (typeof node.value !== "number" || !Number.isFinite(node.value)) throw new Unusable(`expected numbers, got '${String(node.value)}'`);
      return `(${String(node.value)})`;
    }
    case "SymbolNode": {
      if (node.name in symbols) return symbols[node.name];
      if (symbols === CONSTANTS && /^_t\d+$/.test(node.name)) return node.name.slice(1);
      const vars = Object.keys(symbols).filter((k) => k !== "pi" && k !== "e");
      throw new Unusable(`unknown symbol '${node.name}'; expected ${vars.join(", ")}${vars.some((v) => v === "x" || v === "y") ? " (metres)" : ""}, pi or e`);
    }
    case "ParenthesisNode":
      return `(${sub(node.content)})`;
    case "OperatorNode": {
      const args: string[] = node.args.map(sub);
      if (node.fn === "unaryMinus" && args.length === 1) return `(-${args[0]})`;
      if (node.fn === "unaryPlus" && args.length === 1) return args[0];
      if (node.fn === "pow" && args.length === 2) return `Math.pow(${args[0]}, ${args[1]})`;
      const op = OPERATORS[node.fn];
      if (op && args.length === 2) return `(${args[0]} ${op} ${args[1]})`;
      throw new Unusable(`operator '${node.op}' is not allowed; expected + - * / ^`);
    }
    case "FunctionNode": {
      const name: string = node.fn?.name ?? node.name;
      const gen = fns[name];
      const arity = ARITY[name] ?? 1;
      if (!gen) throw new Unusable(`function '${name}' is not allowed; expected one of ${Object.keys(fns).sort().join(", ")}`);
      if (node.args.length !== arity) throw new Unusable(`${name} takes ${arity} argument${arity === 1 ? "" : "s"}`);
      return gen(node.args.map(sub));
    }
    default:
      throw new Unusable(`'${node.toString()}' is not allowed in a map; expected arithmetic on x and y`);
  }
}

interface Aux { u: any; v: any }

/** Replace every atan2(u, v) by a symbol _tK (inner ones first), recording u and v. */
function lift(math: any, node: any, aux: Aux[]): any {
  if (node.type === "FunctionNode" && (node.fn?.name ?? node.name) === "atan2") {
    if (node.args.length !== 2) throw new Unusable("atan2 takes 2 arguments");
    const u = lift(math, node.args[0], aux), v = lift(math, node.args[1], aux);
    aux.push({ u, v });
    return new math.SymbolNode(`_t${aux.length - 1}`);
  }
  return node.map((child: any) => lift(math, child, aux));
}

const uses = (node: any, name: string): boolean => node.filter((n: any) => n.type === "SymbolNode" && n.name === name).length > 0;

/** JavaScript for the total derivative of `node` along `v` ("x" or "y"), through the aux values. */
function totalDerivative(math: any, node: any, v: "x" | "y", aux: Aux[]): string {
  const parts = [toJs(math.derivative(node, v))];
  for (let k = 0; k < aux.length; k++) {
    if (uses(node, `_t${k}`)) parts.push(`(${toJs(math.derivative(node, `_t${k}`))} * t${k}${v})`);
  }
  return parts.join(" + ");
}

/**
 * Compile the map x = X(x', y'), y = Y(x', y'). `where` names the place of each expression
 * (e.g. "design.json: $.transform.virtual"). Throws InputError naming the expression when it
 * cannot be parsed, uses anything outside the whitelist, or cannot be differentiated.
 * Example: (await compileExpressionMap({ x: "2*x", y: "y" }, w))(out, 1, 1) → out = [2, 1, 2, 0, 0, 1]
 */
export async function compileExpressionMap(virtual: { x: string; y: string }, where: string): Promise<CompiledMap> {
  const math = await getMath();
  const aux: Aux[] = [];
  const lifted: Record<"x" | "y", any> = { x: null, y: null };
  let current: "x" | "y" = "x";
  try {
    for (const key of ["x", "y"] as const) {
      current = key;
      let node: any;
      checkSize(virtual[key]);
      try {
        node = math.parse(virtual[key]);
      } catch (err) {
        throw new Unusable(`cannot parse: ${(err as Error).message}`);
      }
      toJs(node); // whitelist check before anything else
      lifted[key] = lift(math, node, aux);
    }
    const lines: string[] = [];
    for (let k = 0; k < aux.length; k++) {
      const { u, v } = aux[k];
      lines.push(`const u${k} = ${toJs(u)}, v${k} = ${toJs(v)};`);
      lines.push(`const t${k} = Math.atan2(u${k}, v${k}), q${k} = u${k} * u${k} + v${k} * v${k};`);
      for (const d of ["x", "y"] as const) {
        lines.push(`const t${k}${d} = (v${k} * (${totalDerivative(math, u, d, aux)}) - u${k} * (${totalDerivative(math, v, d, aux)})) / q${k};`);
      }
    }
    const body: string[] = [];
    for (const key of ["x", "y"] as const) {
      current = key;
      body.push(toJs(lifted[key]), totalDerivative(math, lifted[key], "x", aux), totalDerivative(math, lifted[key], "y", aux));
    }
    const code = [
      '"use strict";',
      "return function map(out, x, y) {",
      ...lines,
      `out[0] = ${body[0]}; out[1] = ${body[3]};`,
      `out[2] = ${body[1]}; out[3] = ${body[2]};`,
      `out[4] = ${body[4]}; out[5] = ${body[5]};`,
      "};",
    ].join("\n");
    // The generated source contains only whitelisted tokens produced by toJs above.
    return new Function(code)() as CompiledMap;
  } catch (err) {
    if (err instanceof InputError) throw err;
    // a RangeError here is the call stack running out in a recursive walk: too deep a formula
    const msg = err instanceof Unusable ? err.message
      : err instanceof RangeError ? `nested too deeply to differentiate; expected at most ${MAX_EXPRESSION_DEPTH} levels`
      : `cannot form the Jacobian: ${clipExpression((err as Error).message)}`;
    throw new InputError({ where: `${where}.${current}`, message: `unusable map '${clipExpression(virtual[current])}': ${msg}` });
  }
}

/** Functions a side or boundary curve may use: those of maps, plus max and min (no derivative is taken). */
const CURVE_FUNCTIONS: Record<string, (a: string[]) => string> = {
  ...FUNCTIONS,
  max: (a) => `Math.max(${a[0]}, ${a[1]})`, min: (a) => `Math.min(${a[0]}, ${a[1]})`,
};

/**
 * Compile a curve given as an expression of one variable (`x`, `y`, `t` or `theta`), e.g. the
 * bottom side "0.4e-6*cos(pi*x/3.8e-6)^2" of a carpet, with the same whitelist as maps plus
 * max/min. Throws InputError at `where` when it cannot be parsed or uses anything else.
 * Example: (await compileCurveExpression("2*t + 1", "t", w))(0.5) → 2
 */
export async function compileCurveExpression(text: string, variable: "x" | "y" | "t" | "theta", where: string): Promise<(v: number) => number> {
  const math = await getMath();
  try {
    let node: any;
    try {
      node = math.parse(text);
    } catch (err) {
      throw new Unusable(`cannot parse: ${(err as Error).message}`);
    }
    const code = `"use strict"; return function curve(v) { return ${toJs(node, { pi: "Math.PI", e: "Math.E", [variable]: "v" }, CURVE_FUNCTIONS)}; };`;
    // The generated source contains only whitelisted tokens produced by toJs.
    return new Function(code)() as (v: number) => number;
  } catch (err) {
    const msg = err instanceof Unusable ? err.message : (err as Error).message;
    throw new InputError({ where, message: `unusable curve '${text}': ${msg}` });
  }
}
