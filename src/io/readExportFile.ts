import { createHash } from 'node:crypto';
import { open, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { InputError, Warning } from '../types.js';
import { warning } from '../warnings.js';
import { calibrationOffsetDb } from './calibrationOffset.js';
import { parseFrequencyText } from './frequencyText.js';
import { generalTokenize } from './generalTokenizer.js';
import { ErrorList, inputError } from './inputError.js';
import { KeyTable } from './keyTable.js';
import type { PlanFacts } from './layouts/layoutTypes.js';
import { DropoutLog } from './layouts/dropoutLog.js';
import { isLayoutHeader, planLayout } from './layouts/registry.js';
import { parseNumberText } from './numberText.js';
import { pathIdentity } from './pathIdentity.js';
import { MAIN_SHARE, PARALLEL_MIN_BYTES, readFast } from './readInParallel.js';
import { MAX_SAMPLES_PER_FILE, SampleLimit } from './sampleLimit.js';
import { HEAD_BYTES, sniffHead } from './sniffHead.js';
import type { TokenContext } from './textRow.js';
import type { FileInfo, FileReadResult, RawBeam, ReadContext } from './types.js';


function emptyInfo(): FileInfo {
  return {
    layout: null, delimiter: null, decimalComma: false, bom: false, lineEnding: null, parser: null, columns: [],
    quantity: null, valueUnit: null, fileValueUnit: null, angleConvention: null, angleUnit: null, rows: 0,
    metadata: {}, identity: { unit: 'none', beam: 'none', frequency: 'none' }, calibrated: false,
  };
}

/**
 * Read one chamber export (long or matrix layout, any supported dialect) into raw beams.
 * Never throws for bad input: problems come back as `errors` (file:line:col grammar), and a
 * file with errors yields no beams. Plain numeric files stream through the byte-level fast
 * path (a large long-layout file on two threads when `ctx.readThreads` allows: readInParallel.ts);
 * quoted or irregular ones go through papaparse; all give identical results.
 * @throws only on programming errors (never for file content or a missing file).
 */
export async function readExportFile(absPath: string, ctx: ReadContext): Promise<FileReadResult> {
  const file = path.relative(ctx.inputRoot, absPath).split(path.sep).join('/') || path.basename(absPath);
  const info = emptyInfo();
  const result: FileReadResult = { file, sha256: '', info, beams: [], errors: [], warnings: [] };
  let fh;
  try {
    fh = await open(absPath, 'r');
  } catch (e) {
    result.errors.push({ file, message: `${file}: cannot open the file (${(e as NodeJS.ErrnoException).code ?? 'error'}), expected a readable file` });
    return result;
  }
  try {
    const size = (await fh.stat()).size;
    const head = Buffer.alloc(Math.min(size, HEAD_BYTES));
    await fh.read(head, 0, head.length, 0);
    const sniff = sniffHead(file, head, size <= HEAD_BYTES, { line: ctx.job?.headerLine, isHeader: (cells) => isLayoutHeader(cells, ctx.job) });
    if (!('delimiter' in sniff)) {
      result.sha256 = createHash('sha256').update(await readFile(absPath)).digest('hex');
      result.errors.push(sniff);
      return result;
    }
    Object.assign(info, {
      delimiter: sniff.delimiter, decimalComma: sniff.decimalComma, bom: sniff.bom, lineEnding: sniff.lineEnding, metadata: sniff.metadata,
      header: { line: sniff.headerLine, chosen: sniff.headerChoice, preambleLines: sniff.preambleLines },
    });
    const headerNums = sniff.headerCells.map((c) => parseNumberText(c, sniff.decimalComma));
    if (headerNums.every((v) => typeof v === 'number')) {
      result.errors.push(inputError(file, sniff.headerLine, 1, 'header', sniff.headerText, 'a header row naming the columns (for example theta,phi,eirp_dbm)'));
      result.sha256 = createHash('sha256').update(await readFile(absPath)).digest('hex');
      return result;
    }
    const planned = planLayout(sniff.headerCells, {
      file, headerLine: sniff.headerLine, cellCols: sniff.headerCellCols, headerText: sniff.headerText, decimalComma: sniff.decimalComma,
      metadata: sniff.metadata, metadataLines: sniff.metadataLines, job: ctx.job, quantityOverride: ctx.quantityOverride,
    });
    result.warnings.push(...planned.warnings);
    if (!planned.planned) {
      result.errors.push(...planned.errors);
      result.sha256 = createHash('sha256').update(await readFile(absPath)).digest('hex');
      return result;
    }
    const layout = planned.planned;
    const plan = layout.facts;
    Object.assign(info, {
      layout: plan.layout, columns: plan.columns, quantity: plan.quantity, valueUnit: plan.valueUnit, fileValueUnit: plan.fileValueUnit,
      angleConvention: plan.angleConvention, angleUnit: plan.angleUnit, ...layout.info,
    });
    if (layout.headerErrors.length) {
      result.errors.push(...layout.headerErrors);
      result.sha256 = createHash('sha256').update(await readFile(absPath)).digest('hex');
      return result;
    }

    const dropoutTokens = ctx.job?.dropoutTokens ? new Set(ctx.job.dropoutTokens.map((s) => s.trim().toLowerCase())) : null;
    const maxSamples = ctx.maxSamples ?? MAX_SAMPLES_PER_FILE;
    const run = async (useFast: boolean) => {
      const errors = new ErrorList(file);
      const keys = new KeyTable(plan.fields.keyCount);
      const dropouts = new DropoutLog();
      const sink = layout.newSink({ file, errors, keys, firstDataLine: sniff.headerLine + 1, dropouts, sharedValues: (ctx.readThreads ?? 1) > 1 });
      const limited = new SampleLimit(sink, layout.samplesPerRow, maxSamples, file, errors);
      const t: TokenContext = {
        file, fields: plan.fields, delimiter: sniff.delimiter, decimalComma: sniff.decimalComma, errors, keys, sink: limited,
        nums: new Float64Array(Math.max(1, plan.fields.numCount)), keyIds: new Int32Array(Math.max(1, plan.fields.keyCount)), dropoutTokens,
      };
      if (useFast) {
        const outcome = await readFast({
          fh: fh!, absPath, file, size, dataStart: sniff.dataByteStart, startLine: sniff.headerLine + 1, t, sink, limited, plan,
          dropoutTokens: dropoutTokens === null ? null : [...dropoutTokens], threads: ctx.readThreads ?? 1,
          minBytes: ctx.parallelMinBytes ?? PARALLEL_MIN_BYTES, share: ctx.parallelShare ?? MAIN_SHARE, onOutcome: ctx.onParallel,
          maxSamples, chunkBytes: ctx.chunkBytes, workerHashes: ctx.workerHashes ?? true,
        });
        if (outcome === 'quote') return null;
        return { errors, keys, sink, dropouts, sha: outcome.sha256 };
      }
      const bytes = await readFile(absPath);
      const text = bytes.toString('utf8', sniff.bom ? 3 : 0);
      generalTokenize(text, sniff.dataCharStart, sniff.headerLine + 1, sniff.lineEnding === 'CRLF' ? '\r\n' : '\n', t);
      return { errors, keys, sink, dropouts, sha: createHash('sha256').update(bytes).digest('hex') };
    };
    const wantFast = ctx.parser === 'fast' || (ctx.parser !== 'general' && !sniff.quoted);
    let outcome = wantFast ? await run(true) : null;
    info.parser = outcome ? 'fast' : 'general';
    outcome ??= await run(false);
    if (!outcome) throw new Error('unreachable: general path always completes');
    result.sha256 = outcome.sha;
    info.rows = outcome.sink.rows;
    const errs = outcome.errors;
    if (errs.count === 0 && outcome.sink.rows === 0) {
      errs.add(inputError(file, sniff.headerLine + 1, 1, 'data', 'no data rows', 'at least one row below the header', true));
    }
    if (errs.count > 0) {
      result.errors.push(...errs.finish());
      return result;
    }
    const id = pathIdentity(file, ctx.job, path.basename(ctx.inputRoot));
    const meta = sniff.metadata;
    const identity = { ...id.sources };
    const metaUnit = meta.unit?.trim() || meta.dut?.trim() || meta.serial?.trim();
    const metaBeam = meta.beam?.trim();
    const metaFreq = meta.frequency ?? meta.freq;
    const fileUnit = metaUnit || id.unit;
    if (metaUnit) identity.unit = 'metadata';
    const fileBeam = metaBeam || id.beam;
    if (metaBeam) identity.beam = 'metadata';
    let fileFreqHz = id.frequencyHz;
    if (metaFreq !== undefined) {
      const f = parseFrequencyText(metaFreq);
      if (f === null) {
        const line = sniff.metadataLines.frequency ?? sniff.metadataLines.freq;
        result.errors.push(inputError(file, line, 1, 'frequency', metaFreq, "a frequency such as '28 GHz' or '28000 MHz'"));
        return result;
      }
      fileFreqHz = f;
      identity.frequency = 'metadata';
    }
    const base = { quantity: plan.quantity, valueUnit: plan.valueUnit, file, metadata: meta };
    const built = outcome.sink.beams({ file, keys: outcome.keys, base, fileUnit, fileBeam, fileFreqHz, identity, warnings: result.warnings });
    if ('errors' in built) {
      result.errors.push(...built.errors);
      return result;
    }
    const beams = built.beams;
    info.identity = identity;
    if (identity.unit === 'folder' || identity.unit === 'file-name' || identity.beam === 'file-name') {
      const fromPath = [
        identity.unit === 'folder' || identity.unit === 'file-name' ? `unit '${beams[0].unit}' from the ${identity.unit === 'folder' ? 'folder name' : 'file name'}` : null,
        identity.beam === 'file-name' ? `beam '${beams[0].beam}' from the file name` : null,
      ].filter((t) => t !== null);
      result.warnings.push(warning('identity-from-path', `${fromPath.join(', ')}`, { file }));
    }
    const dl = outcome.dropouts;
    if (dl.count > 0) {
      for (const b of beams) b.hasDropouts = true;
      const more = dl.count > dl.shown.length ? `, and ${dl.count - dl.shown.length} more` : '';
      result.warnings.push(warning('dropout-samples', `${dl.count} dropout cell${dl.count === 1 ? '' : 's'} (dropout_tokens in the job file) read as missing samples: ${dl.shown.join(', ')}${more}`, { file, line: dl.firstLine }));
    }
    if (plan.fileValueUnit === 'mW' || plan.fileValueUnit === 'W') {
      result.warnings.push(warning('unit-converted', `values in ${plan.fileValueUnit} converted to dBm`, { file }));
    }
    if (plan.angleConvention === 'az-el' || plan.angleUnit === 'rad') {
      result.warnings.push(warning('angle-convention', plan.angleConvention === 'az-el'
        ? `azimuth/elevation in ${plan.angleUnit === 'rad' ? 'radians' : 'degrees'} converted to θ/φ in degrees (θ = 90° − el, φ = az mod 360°)`
        : 'θ/φ in radians converted to degrees', { file }));
    }
    if (plan.power) {
      const cal = applyCalibration(beams, plan, ctx, file);
      if (cal.errors.length) {
        result.errors.push(...cal.errors);
        return result;
      }
      info.calibrated = true;
      result.warnings.push(...cal.warnings);
    }
    result.beams = beams;
    return result;
  } catch (e) {
    result.errors.push({ file, message: `${file}: cannot read the file (${(e as Error).message}), expected a readable text export` });
    return result;
  } finally {
    await fh.close();
  }
}

function applyCalibration(beams: RawBeam[], plan: PlanFacts, ctx: ReadContext, file: string): { errors: InputError[]; warnings: Warning[] } {
  const table = ctx.job!.calibration!.table;
  const errors: InputError[] = [];
  const warnings: Warning[] = [];
  const freqCol = plan.columns.find((c) => c.role === 'frequency');
  const range = `${table[0].frequencyHz / 1e9}–${table[table.length - 1].frequencyHz / 1e9} GHz`;
  const done = new Set<number>();
  for (const b of beams) {
    const line = b.firstLine ?? 1;
    if (b.frequencyHz === null) {
      errors.push(inputError(file, line, 1, 'frequency', 'no frequency', 'a frequency (freq column, <n>GHz file-name token or # frequency: line) to look up the calibration', true));
      continue;
    }
    const off = calibrationOffsetDb(table, b.frequencyHz);
    if (off === null) {
      errors.push(inputError(file, line, 1, freqCol?.name ?? 'frequency', `${b.frequencyHz / 1e9} GHz`,
        `a frequency inside the calibration table (${range}); calibration does not extrapolate`));
      continue;
    }
    const v = new Float64Array(b.values.length);
    for (let i = 0; i < v.length; i++) v[i] = b.values[i] + off; // EIRP = P_rx + offset(f), Eq. (C1) in calibrationOffset.ts
    b.values = v;
    if (!done.has(b.frequencyHz)) {
      done.add(b.frequencyHz);
      warnings.push(warning('calibration-applied', `received power + ${off.toFixed(3)} dB at ${b.frequencyHz / 1e9} GHz (job file calibration) gives EIRP`, { file }));
    }
  }
  return { errors, warnings };
}
