import type { MixedList, EntitySchema } from 'typeorm';

/** Every TypeORM entity, listed by hand (no globs: tsx and Vite do not resolve them). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const entities: MixedList<(new () => unknown) | EntitySchema<any>> = [];
