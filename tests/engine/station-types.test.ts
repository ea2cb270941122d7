// The station types are the zod schemas' own output types (one definition): what the schema
// accepts is what the engine's types describe, checked here by the compiler (npm run typecheck).
import { describe, expectTypeOf, it } from 'vitest';
import type * as z from 'zod';
import type { referencePortSchema, secondaryPortSchema } from '../../engine/stations/schema.js';
import type { Position, ReferenceStation, SecondaryStation, Station, WindowSpec } from '../../engine/types.js';
import type { ProjectSettings } from '../../cli/build/project.js';

describe('station and project types follow their schemas', () => {
  it('a parsed station file is a station, field for field', () => {
    expectTypeOf<z.output<typeof referencePortSchema>>().toExtend<ReferenceStation>();
    expectTypeOf<z.output<typeof secondaryPortSchema>>().toExtend<SecondaryStation>();
    expectTypeOf<ReferenceStation['kind']>().toEqualTypeOf<'reference'>();
    expectTypeOf<Station['kind']>().toEqualTypeOf<'reference' | 'secondary'>();
    expectTypeOf<Position>().toEqualTypeOf<{ latitude: number; longitude: number }>();
    expectTypeOf<WindowSpec>().toEqualTypeOf<{ id: string; name: string; above?: number | undefined; below?: number | undefined }>();
    expectTypeOf<ReferenceStation['constituents']>().toEqualTypeOf<Record<string, { amplitude: number; phase: number }>>();
    expectTypeOf<ReferenceStation['datum_epoch']>().toEqualTypeOf<number | undefined>();
    expectTypeOf<SecondaryStation['differences']['low_water']['neaps']>().toEqualTypeOf<{ time: number; height: number }>();
  });

  it('project settings are the project schema’s output', () => {
    expectTypeOf<ProjectSettings['page']>().toEqualTypeOf<'a5' | 'a6' | 'a4' | 'letter' | 'half-letter' | undefined>();
    expectTypeOf<ProjectSettings['year']>().toEqualTypeOf<number[] | undefined>(); // one year or a range, as its years
  });
});
