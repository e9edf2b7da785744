/**
 * The engine's own elementary functions. Nothing in shared/engine calls Math.exp, Math.log,
 * Math.sin, ... (tests/architecture.test.ts forbids it): their results are
 * implementation-approximated by the standard, so Node and a browser may differ in the last bit
 * and with them the digest. Everything here uses only IEEE-754 double arithmetic (exactly
 * specified), so a replay gives the same bits on every JavaScript engine.
 */
export { exp } from './fast-exp';
export { log } from './fast-log';
export { cos, sin, sinCos } from './fast-sincos';
export { hypot } from './hypot';
export { atan, atan2, log1p } from './reference-functions';
