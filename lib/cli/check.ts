// `shiftload check JOB`: load and validate a job file against its recordings without analysing —
// the dry run before a long analysis. Prints a short summary; --json prints it (or every problem).
import type { CommandModule } from 'yargs';
import { loadJob } from '../job/load-job.js';
import type { DescribeRecording } from '../job/describe-recording.js';
import { JobValidationError } from '../job/job-validation-error.js';
import type { Study } from '../job/study-types.js';
import type { WithIO } from './cli-io.js';

/** Plain summary numbers of a study. */
export interface StudySummary {
  title: string;
  workers: number;
  recordings: number;
  channels: number;
  segments: number;
  recorded_h: number;
  segments_h: number;
  conditions: string[];
  muscles: string[];
}

/** Count workers, recordings, channels, segments and hours of a loaded study. */
export function summarizeStudy(study: Study): StudySummary {
  let recordings = 0; let channels = 0; let segments = 0; let recorded = 0; let inSegments = 0;
  const conditions = new Set<string>();
  const muscles = new Set<string>();
  for (const w of study.workers) {
    for (const r of w.recordings) {
      recordings++;
      channels += r.channels.length;
      segments += r.segments.length;
      recorded += r.duration_s;
      for (const s of r.segments) inSegments += s.end_s - s.start_s;
      conditions.add(r.condition);
      for (const c of r.channels) muscles.add(c.muscle);
    }
  }
  return {
    title: study.title, workers: study.workers.length, recordings, channels, segments,
    recorded_h: recorded / 3600, segments_h: inSegments / 3600,
    conditions: [...conditions], muscles: [...muscles],
  };
}

type CheckArgs = WithIO & { job: string; json: boolean; describeRecording?: DescribeRecording };

export const checkCommand: CommandModule<object, CheckArgs> = {
  command: 'check <job>',
  describe: 'Validate a job file and its recordings without analysing (a dry run)',
  builder: (y) => y
    .positional('job', { type: 'string', demandOption: true, describe: 'the job file (YAML)' })
    .option('json', { type: 'boolean', default: false, describe: 'print the summary, or every problem found, as JSON' })
    .example('$0 check job.yaml', 'check files, signals, segments and settings; print a summary')
    .example('$0 check job.yaml --json', 'the same as JSON (with all problems when there are several)') as never,
  handler: async (argv) => {
    let study: Study;
    try {
      study = await loadJob(argv.job, { describeRecording: argv.describeRecording });
    } catch (e) {
      if (argv.json && e instanceof JobValidationError) {
        argv.io.out(JSON.stringify({ ok: false, issues: e.issues.map(({ file, line, path, what, message }) => ({ file, line, path, what, message })) }, null, 2) + '\n');
      }
      throw e;
    }
    const s = summarizeStudy(study);
    if (argv.json) {
      argv.io.out(JSON.stringify({ ok: true, summary: s, settings: study.settings, gapThreshold: study.gapThreshold }, null, 2) + '\n');
      return;
    }
    const h = (hours: number) => formatDuration(hours * 3600);
    const lines = [
      `${argv.job}: valid — ${s.title}`,
      `  ${s.workers} worker(s), ${s.recordings} recording(s), ${s.channels} channel(s), ${s.segments} segment(s)`,
      `  recorded ${h(s.recorded_h)}, in segments ${h(s.segments_h)}`,
      `  conditions: ${s.conditions.join(', ')}`,
      `  muscles: ${s.muscles.join(', ')}`,
      `  normalize ${study.settings.normalize} (${study.unit === 'uV' ? 'µV' : study.unit})`,
      `  ${study.gapThreshold.note}`,
    ];
    for (const w of study.workers) {
      for (const r of w.recordings) {
        const seg = r.segments.reduce((a, x) => a + x.end_s - x.start_s, 0);
        lines.push(`  ${w.id}  ${r.fileAsWritten}  ${r.condition}  ${r.channels.length} ch  ${r.segments.length} seg  ${h(r.duration_s / 3600)} recorded, ${h(seg / 3600)} in segments`);
      }
    }
    argv.io.out(lines.join('\n') + '\n');
  },
};

/** A duration for people: "42 s", "12.5 min", "7.50 h". */
export function formatDuration(seconds: number): string {
  if (seconds < 60) return `${Number(seconds.toFixed(1))} s`;
  if (seconds < 3600) return `${Number((seconds / 60).toFixed(1))} min`;
  return `${(seconds / 3600).toFixed(2)} h`;
}
