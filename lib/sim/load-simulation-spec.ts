// Reads and validates a simulation spec (YAML, format shiftload-simulation/1). Every problem is an
// InputError naming the file and the key path; defaults come from SIM_DEFAULTS.
import { readFileSync } from 'node:fs';
import { load as yamlLoad } from 'js-yaml';
import { InputError } from '../errors.js';
import { msg, simMsg } from '../messages.js';
import {
  SIM_DEFAULTS, type ArtifactSpec, type ConditionSpec, type MuscleSpec, type ReferenceSpec, type SimulationSpec,
  type TaskDesign, type VariantSpec, type WorkerSpec,
} from './simulation-spec.js';

type Obj = Record<string, unknown>;

/**
 * Load a simulation spec from a YAML file.
 * @throws InputError when the file is missing, not YAML, or a field is missing or out of range
 * @example const spec = loadSimulationSpec('sample-jobs/parcel-packing/simulation.yaml')
 */
export function loadSimulationSpec(file: string): SimulationSpec {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw new InputError(msg.fileNotFound(file), { file });
    if (code === 'EISDIR') throw new InputError(msg.notAFile(file), { file });
    throw new InputError(msg.cannotRead(file, code ?? String(e)), { file });
  }
  return parseSimulationSpec(text, file);
}

/** Parse and validate spec text; `file` is only used in messages. */
export function parseSimulationSpec(text: string, file: string): SimulationSpec {
  let doc: unknown;
  try {
    doc = yamlLoad(text);
  } catch (e) {
    const m = e as { mark?: { line: number }; reason?: string; message: string };
    throw new InputError(simMsg.specYaml(file, (m.mark?.line ?? 0) + 1, m.reason ?? m.message), { file });
  }
  if (!isObj(doc)) throw new InputError(simMsg.specNotMapping(file), { file });
  const r = new Reader(file);
  if (doc.format !== 'shiftload-simulation/1') throw new InputError(simMsg.specFormat(file, show(doc.format)), { file, where: 'format' });

  const muscles: MuscleSpec[] = r.list(doc, 'muscles', 'muscles').map((m, i) => {
    const p = `muscles[${i}]`;
    const o = r.obj(m, p);
    const signal = r.str(o, 'signal', p);
    // EDF label field: 16 printable ASCII characters
    if (signal.length > 16 || !/^[\x20-\x7e]+$/.test(signal)) {
      throw new InputError(simMsg.specField(file, `${p}.signal`, 'at most 16 printable ASCII characters (EDF label)', show(signal)), { file, where: `${p}.signal` });
    }
    return { id: r.str(o, 'id', p), signal, muscle: r.str(o, 'muscle', p) };
  });
  r.unique(muscles.map((m) => m.id), 'muscles');
  const muscleIds = muscles.map((m) => m.id);

  const refObj = doc.reference === undefined ? {} : r.obj(doc.reference, 'reference');
  const rd = SIM_DEFAULTS.reference;
  const reference: ReferenceSpec = {
    trials: r.int(refObj, 'trials', 'reference', 1, 10, rd.trials),
    lead_s: r.num(refObj, 'lead_s', 'reference', 0, 600, rd.lead_s),
    ramp_s: r.num(refObj, 'ramp_s', 'reference', 0.05, 60, rd.ramp_s),
    hold_s: r.num(refObj, 'hold_s', 'reference', 0.5, 60, rd.hold_s),
    release_s: r.num(refObj, 'release_s', 'reference', 0.05, 60, rd.release_s),
    between_s: r.num(refObj, 'between_s', 'reference', 0, 600, rd.between_s),
    hold_pct: r.num(refObj, 'hold_pct', 'reference', 1, 200, rd.hold_pct),
  };

  const conditions: ConditionSpec[] = r.list(doc, 'conditions', 'conditions').map((c, i) => {
    const p = `conditions[${i}]`;
    const o = r.obj(c, p);
    const id = r.str(o, 'id', p);
    const tasksObj = r.obj(o.tasks, `${p}.tasks`);
    const tasks: ConditionSpec['tasks'] = {};
    for (const [task, perMuscle] of Object.entries(tasksObj)) {
      const tp = `${p}.tasks.${task}`;
      const pm = r.obj(perMuscle, tp);
      tasks[task] = {};
      for (const mid of muscleIds) {
        if (!(mid in pm)) throw new InputError(simMsg.specField(file, `${tp}.${mid}`, 'a task design for every muscle', 'nothing'), { file, where: `${tp}.${mid}` });
        tasks[task][mid] = readTask(r, pm[mid], `${tp}.${mid}`);
      }
      for (const k of Object.keys(pm)) if (!muscleIds.includes(k)) throw new InputError(simMsg.specUnknownRef(file, `${tp}.${k}`, 'muscle', k, muscleIds), { file });
    }
    const cycle = r.list(o, 'cycle', p).map((s, j) => {
      const sp = `${p}.cycle[${j}]`;
      const so = r.obj(s, sp);
      const task = r.str(so, 'task', sp);
      if (!(task in tasks)) throw new InputError(simMsg.specUnknownRef(file, `${sp}.task`, 'task', task, Object.keys(tasks)), { file });
      return { task, duration_s: r.num(so, 'duration_s', sp, 1, 86400) };
    });
    return { id, cycle, tasks };
  });
  r.unique(conditions.map((c) => c.id), 'conditions');
  const condIds = conditions.map((c) => c.id);

  const variantsObj = r.obj(doc.variants, 'variants');
  const variants: Record<string, VariantSpec> = {};
  for (const [name, v] of Object.entries(variantsObj)) {
    const o = r.obj(v, `variants.${name}`);
    variants[name] = {
      duration_s: r.int(o, 'duration_s', `variants.${name}`, 10, 7 * 86400), // whole seconds: whole EDF records
      cycle_scale: r.num(o, 'cycle_scale', `variants.${name}`, 0.01, 1000, SIM_DEFAULTS.variant.cycle_scale),
    };
  }
  if (Object.keys(variants).length === 0) throw new InputError(simMsg.specField(file, 'variants', 'at least one variant', 'none'), { file });

  const workers: WorkerSpec[] = r.list(doc, 'workers', 'workers').map((w, i) => {
    const p = `workers[${i}]`;
    const o = r.obj(w, p);
    const id = r.str(o, 'id', p);
    const mo = r.obj(o.muscles, `${p}.muscles`);
    const ms: WorkerSpec['muscles'] = {};
    for (const mid of muscleIds) {
      const mp = `${p}.muscles.${mid}`;
      const m = r.obj(mo[mid], mp);
      ms[mid] = {
        mve_uv: r.num(m, 'mve_uv', mp, 1, 1e5),
        noise_uv: r.num(m, 'noise_uv', mp, 0, 1e4),
        load: r.num(m, 'load', mp, 0, 100, SIM_DEFAULTS.worker_muscle.load),
        rest: r.num(m, 'rest', mp, 0, 100, SIM_DEFAULTS.worker_muscle.rest),
      };
    }
    const conds: WorkerSpec['conditions'] = {};
    const co = o.conditions === undefined ? {} : r.obj(o.conditions, `${p}.conditions`);
    for (const [cid, per] of Object.entries(co)) {
      const cp = `${p}.conditions.${cid}`;
      if (!condIds.includes(cid)) throw new InputError(simMsg.specUnknownRef(file, cp, 'condition', cid, condIds), { file });
      conds[cid] = {};
      for (const [mid, f] of Object.entries(r.obj(per, cp))) {
        if (!muscleIds.includes(mid)) throw new InputError(simMsg.specUnknownRef(file, `${cp}.${mid}`, 'muscle', mid, muscleIds), { file });
        const fo = r.obj(f, `${cp}.${mid}`);
        conds[cid][mid] = { load: r.num(fo, 'load', `${cp}.${mid}`, 0, 100, 1), rest: r.num(fo, 'rest', `${cp}.${mid}`, 0, 100, 1) };
      }
    }
    const arts: WorkerSpec['artifacts'] = {};
    const ao = o.artifacts === undefined ? {} : r.obj(o.artifacts, `${p}.artifacts`);
    const recKinds = [...condIds, 'reference', 'rest'];
    for (const [rk, per] of Object.entries(ao)) {
      const ap = `${p}.artifacts.${rk}`;
      if (!recKinds.includes(rk)) throw new InputError(simMsg.specUnknownRef(file, ap, 'recording', rk, recKinds), { file });
      arts[rk] = {};
      for (const [mid, a] of Object.entries(r.obj(per, ap))) {
        if (!muscleIds.includes(mid)) throw new InputError(simMsg.specUnknownRef(file, `${ap}.${mid}`, 'muscle', mid, muscleIds), { file });
        arts[rk][mid] = readArtifacts(r, a, `${ap}.${mid}`);
      }
    }
    return { id, muscles: ms, conditions: conds, artifacts: arts };
  });
  r.unique(workers.map((w) => w.id), 'workers');

  const fmt = doc.output_format ?? SIM_DEFAULTS.output_format;
  if (fmt !== 'edf' && fmt !== 'csv') throw new InputError(simMsg.specField(file, 'output_format', '"edf" or "csv"', show(fmt)), { file });
  const band = doc.noise_band_hz === undefined ? SIM_DEFAULTS.noise_band_hz : r.pair(doc.noise_band_hz, 'noise_band_hz', 0.01, 1e5);
  const fs = r.num(doc, 'sampling_rate_hz', '', 100, 100_000);
  if (band[1] >= fs / 2) throw new InputError(simMsg.specField(file, 'noise_band_hz', `an upper edge below the Nyquist frequency ${fs / 2} Hz`, String(band[1])), { file });
  const designRate = r.num(doc, 'design_rate_hz', '', 1, 1000, SIM_DEFAULTS.design_rate_hz);
  const start = doc.start === undefined ? SIM_DEFAULTS.start : r.str(doc, 'start', '');
  if (!/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d$/.test(start)) throw new InputError(simMsg.specField(file, 'start', "'YYYY-MM-DDTHH:MM:SS'", start), { file });
  const job = doc.job === undefined ? {} : r.obj(doc.job, 'job');
  const settings = job.settings === undefined ? {} : r.obj(job.settings, 'job.settings');

  return {
    format: 'shiftload-simulation/1',
    title: r.str(doc, 'title', ''),
    site: r.str(doc, 'site', ''),
    seed: r.int(doc, 'seed', '', 0, Number.MAX_SAFE_INTEGER, 1),
    sampling_rate_hz: fs,
    design_rate_hz: designRate,
    noise_band_hz: band,
    noise_order: r.int(doc, 'noise_order', '', 1, 10, SIM_DEFAULTS.noise_order),
    start,
    output_format: fmt,
    muscles,
    reference,
    rest_duration_s: r.int(doc, 'rest_duration_s', '', 1, 3600, SIM_DEFAULTS.rest_duration_s),
    conditions,
    variants,
    workers,
    job: { settings },
  };
}

function readTask(r: Reader, v: unknown, p: string): TaskDesign {
  const o = r.obj(v, p);
  const d = SIM_DEFAULTS.task;
  const t: TaskDesign = {
    level_pct: r.num(o, 'level_pct', p, 0, 200),
    spread_pct: r.num(o, 'spread_pct', p, 0, 200, d.spread_pct),
    step_s: o.step_s === undefined ? d.step_s : r.pair(o.step_s, `${p}.step_s`, 0.05, 86400),
    ramp_s: r.num(o, 'ramp_s', p, 0.001, 600, d.ramp_s),
    floor_pct: r.num(o, 'floor_pct', p, 0, 200, d.floor_pct),
    cap_pct: r.num(o, 'cap_pct', p, 0, 200, d.cap_pct),
    gaps_per_min: r.num(o, 'gaps_per_min', p, 0, 60, d.gaps_per_min),
    gap_s: o.gap_s === undefined ? d.gap_s : r.pair(o.gap_s, `${p}.gap_s`, 0.05, 600),
    gap_level_pct: r.num(o, 'gap_level_pct', p, 0, 100, d.gap_level_pct),
    gap_separation_s: r.num(o, 'gap_separation_s', p, 0, 3600, d.gap_separation_s),
  };
  if (t.floor_pct > t.cap_pct) throw new InputError(simMsg.gapDesign(r.file, p, `floor_pct ${t.floor_pct} is above cap_pct ${t.cap_pct}`), { file: r.file, where: p });
  return t;
}

function readArtifacts(r: Reader, v: unknown, p: string): ArtifactSpec {
  const o = r.obj(v, p);
  const a: ArtifactSpec = {};
  if (o.hum !== undefined) {
    const h = r.obj(o.hum, `${p}.hum`);
    a.hum = { amplitude_uv: r.num(h, 'amplitude_uv', `${p}.hum`, 0, 1e5), freq_hz: r.num(h, 'freq_hz', `${p}.hum`, 1, 1e4, 50) };
  }
  if (o.ecg !== undefined) {
    const h = r.obj(o.ecg, `${p}.ecg`);
    a.ecg = { amplitude_uv: r.num(h, 'amplitude_uv', `${p}.ecg`, 0, 1e5), rate_bpm: r.num(h, 'rate_bpm', `${p}.ecg`, 20, 250, 70) };
  }
  if (o.motion !== undefined) {
    a.motion = r.list(o, 'motion', p).map((m, i) => {
      const mp = `${p}.motion[${i}]`;
      const mo = r.obj(m, mp);
      return {
        start_s: r.num(mo, 'start_s', mp, 0, 1e7), duration_s: r.num(mo, 'duration_s', mp, 0.01, 1e5),
        amplitude_uv: r.num(mo, 'amplitude_uv', mp, 0, 1e5), freq_hz: r.num(mo, 'freq_hz', mp, 0.01, 20, 2),
      };
    });
  }
  if (o.dropout !== undefined) {
    a.dropout = r.list(o, 'dropout', p).map((m, i) => {
      const mp = `${p}.dropout[${i}]`;
      const mo = r.obj(m, mp);
      return { start_s: r.num(mo, 'start_s', mp, 0, 1e7), duration_s: r.num(mo, 'duration_s', mp, 0.001, 1e7) };
    });
  }
  if (o.amplifier_uv !== undefined) a.amplifier_uv = r.num(o, 'amplifier_uv', p, 0, 1e4);
  if (o.clip_uv !== undefined) a.clip_uv = r.num(o, 'clip_uv', p, 1, 1e6);
  for (const k of Object.keys(o)) {
    if (!['hum', 'ecg', 'motion', 'dropout', 'amplifier_uv', 'clip_uv'].includes(k)) {
      throw new InputError(simMsg.specUnknownRef(r.file, `${p}.${k}`, 'artifact', k, ['hum', 'ecg', 'motion', 'dropout', 'amplifier_uv', 'clip_uv']), { file: r.file });
    }
  }
  return a;
}

function isObj(v: unknown): v is Obj {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function show(v: unknown): string {
  if (v === undefined) return 'nothing';
  const s = JSON.stringify(v) ?? String(v);
  return s.length > 40 ? s.slice(0, 37) + '...' : s;
}

class Reader {
  constructor(readonly file: string) {}
  private fail(path: string, expected: string, got: unknown): never {
    throw new InputError(simMsg.specField(this.file, path, expected, show(got)), { file: this.file, where: path });
  }
  private at(parent: string, key: string): string {
    return parent ? `${parent}.${key}` : key;
  }
  obj(v: unknown, path: string): Obj {
    if (!isObj(v)) this.fail(path, 'a mapping', v);
    return v;
  }
  list(o: Obj, key: string, parentPath: string): unknown[] {
    const p = key === parentPath ? key : this.at(parentPath, key);
    const v = o[key];
    if (!Array.isArray(v) || v.length === 0) this.fail(p, 'a non-empty list', v);
    return v;
  }
  str(o: Obj, key: string, parent: string): string {
    const v = o[key];
    if (typeof v !== 'string' || v.length === 0) this.fail(this.at(parent, key), 'a non-empty string', v);
    return v;
  }
  num(o: Obj, key: string, parent: string, lo: number, hi: number, dflt?: number): number {
    const v = o[key];
    if (v === undefined && dflt !== undefined) return dflt;
    if (typeof v !== 'number' || !Number.isFinite(v) || v < lo || v > hi) this.fail(this.at(parent, key), `a number in [${lo}, ${hi}]`, v);
    return v;
  }
  int(o: Obj, key: string, parent: string, lo: number, hi: number, dflt?: number): number {
    const v = this.num(o, key, parent, lo, hi, dflt);
    if (!Number.isInteger(v)) this.fail(this.at(parent, key), `an integer in [${lo}, ${hi}]`, v);
    return v;
  }
  pair(v: unknown, path: string, lo: number, hi: number): [number, number] {
    if (!Array.isArray(v) || v.length !== 2 || !v.every((x) => typeof x === 'number' && x >= lo && x <= hi) || v[0] > v[1]) {
      this.fail(path, `[min, max] with ${lo} ≤ min ≤ max ≤ ${hi}`, v);
    }
    return [v[0], v[1]];
  }
  unique(ids: string[], path: string): void {
    const seen = new Set<string>();
    for (const id of ids) {
      if (seen.has(id)) throw new InputError(simMsg.specDuplicate(this.file, path, id), { file: this.file, where: path });
      seen.add(id);
    }
  }
}
