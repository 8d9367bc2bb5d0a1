import { Ajv } from 'ajv';
import { describe, expect, it } from 'vitest';
import { bufferIO } from '../../lib/cli/cli-io.js';
import { main } from '../../lib/cli/main.js';
import { jobSchema } from '../../lib/job/job-schema.js';

describe('shiftload schema', () => {
  it('main(["schema"]) prints parseable JSON equal to the shipped schema, exit 0', async () => {
    const io = bufferIO();
    expect(await main(['schema'], io)).toBe(0);
    const printed = JSON.parse(io.stdout) as object;
    expect(printed).toEqual(JSON.parse(JSON.stringify(jobSchema)));
    expect(new Ajv({ strictTypes: false }).validateSchema(printed)).toBe(true);
  });

  it('main(["schema", "--help"]) shows an example', async () => {
    const io = bufferIO();
    expect(await main(['schema', '--help'], io)).toBe(0);
    expect(io.stdout).toContain('shiftload schema > shiftload-job.schema.json');
  });
});
