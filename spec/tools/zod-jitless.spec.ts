import { config, z } from 'zod';
import { interpretZodParsers } from '../../src/zod-jitless';

/**
 * The client turns zod's compiled parsers off without importing zod in its entry module
 * (src/zod-jitless.ts writes zod's shared settings object): this checks that zod reads that object,
 * so a zod upgrade that moves it fails here rather than as a CSP violation on a phone.
 */
describe('zod set to interpret (the client entry, src/zod-jitless.ts)', () => {
  let before: boolean | undefined;

  beforeEach(() => {
    before = config().jitless;
  });

  afterEach(() => {
    config({ jitless: before });
  });

  it('reaches the settings zod parses with', () => {
    config({ jitless: false });
    interpretZodParsers();
    expect(config().jitless).toBeTrue();
    const schema = z.object({ carryM: z.number(), technique: z.string() });
    expect(schema.parse({ carryM: 31.5, technique: 'lofted' })).toEqual({ carryM: 31.5, technique: 'lofted' });
    expect(schema.safeParse({ carryM: 'far' }).success).toBeFalse();
  });
});
