/**
 * sqrt(x^2 + y^2) from correctly rounded operations only (IEEE-754 square root, products and a
 * sum), so it is the same on every engine; Math.hypot is implementation-approximated. Engine
 * inputs are metres and radians, far from overflow, so the scaling Math.hypot does is not needed.
 */
export function hypot(x: number, y: number): number {
  return Math.sqrt(x * x + y * y);
}
