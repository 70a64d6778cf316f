/**
 * Keeps a zod schema and a TypeScript type declared elsewhere (the engine's PlantResult) from
 * drifting apart: `mirrorOf<PlantResult>()(schema)` compiles only while the schema's output
 * and the type accept exactly the same values, field for field, in both directions. A field
 * added to, removed from or retyped in either one fails the typecheck, never a parse at run time.
 */
import type * as z from 'zod/mini';

/** Arrays and objects made read-only all the way down, so `readonly` alone is no difference. */
export type Frozen<T> = T extends readonly (infer U)[]
  ? readonly Frozen<U>[]
  : T extends object
    ? { readonly [K in keyof T]: Frozen<T[K]> }
    : T;

/** True when each of A and B is assignable to the other. */
type Mutual<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;

/** What the compiler reports on a drift: the schema no longer describes the type. */
interface DriftedFrom<T> {
  readonly 'this schema and the type it mirrors have drifted apart: compare their fields': T;
}

/**
 * A checked identity: returns the schema unchanged, after the compiler has checked that its
 * output is the type `T`.
 */
export function mirrorOf<T>() {
  return <S extends z.ZodMiniType>(
    schema: S & (Mutual<Frozen<z.output<S>>, Frozen<T>> extends true ? unknown : DriftedFrom<T>),
  ): S => schema;
}
