import { readHeaderCell } from './header-units';
import { readQuantity } from './quantity';
import type { CaptureMetadata } from './types';

/** What a preamble key sets. */
export type SettingKind =
  | 'attenuation'
  | 'voltsPerDiv'
  | 'offset'
  | 'sampleRate'
  | 'interval'
  | 'start'
  | 'verticalUnit'
  | 'horizontalUnit'
  | 'coupling'
  | 'bandwidthLimit'
  | 'inputResistance';

// Keys as bench exports spell them, compared lower-cased with everything but letters and digits removed.
const KEYS: Record<SettingKind, string[]> = {
  attenuation: ['probe', 'probeatten', 'probeattenuation', 'attenuation', 'atten', 'proberatio', 'probefactor', 'probemultiplier', 'probesetting', 'proberatio'],
  voltsPerDiv: ['verticalscale', 'vscale', 'voltsdiv', 'vdiv', 'voltsperdiv', 'voltsperdivision', 'verticalsensitivity', 'sensitivity', 'yscale', 'scale', 'verticalgain'],
  offset: ['verticaloffset', 'offset', 'voffset', 'yoffset', 'dcoffset'],
  sampleRate: ['samplerate', 'samplingrate', 'sarate', 'samplingfrequency', 'samplefrequency', 'samplespersecond'],
  interval: ['sampleinterval', 'samplinginterval', 'increment', 'xincrement', 'xinc', 'dt', 'deltat', 'timeincrement', 'horizontalincrement', 'timeinterval', 'secondsperpoint', 'timeperpoint', 'interval', 'timestep', 'tinc'],
  start: ['start', 'xstart', 'x0', 'xorigin', 'starttime', 'timestart', 'tstart', 'firstpointtime', 'tstart', 'xzero', 'horizontalstart'],
  verticalUnit: ['verticalunits', 'verticalunit', 'yunit', 'yunits', 'vunit', 'vunits', 'units', 'unit', 'voltageunit', 'amplitudeunit', 'verticalunitname'],
  horizontalUnit: ['horizontalunits', 'horizontalunit', 'xunit', 'xunits', 'hunit', 'hunits', 'timeunit', 'timeunits'],
  coupling: ['coupling', 'inputcoupling', 'couple'],
  bandwidthLimit: ['bandwidthlimit', 'bwlimit', 'bwl', 'bandwidth', 'bw', 'bandwidthlimitfilter', 'bwlimitfilter'],
  inputResistance: ['impedance', 'inputimpedance', 'inputresistance', 'termination', 'inputterm', 'inputtermination', 'input'],
};
const KIND_OF: Record<string, SettingKind> = Object.create(null);
for (const [kind, keys] of Object.entries(KEYS)) for (const key of keys) KIND_OF[key] = kind as SettingKind;

const CHANNEL = /(?:^|[^a-z])(?:ch|channel|chan|trace)\s*[-_:#]?\s*(\d{1,2})(?![\d])/iu;

/** Reads a key: which setting it names and for which channel (null: every channel). */
export function readSettingKey(key: string): { kind: SettingKind; channel: number | null } | null {
  const channelMatch = CHANNEL.exec(key);
  const rest = channelMatch ? key.replace(channelMatch[0], ' ') : key;
  const normal = rest.toLowerCase().replace(/\([^)]*\)|\[[^\]]*\]/gu, '').replace(/[^a-z0-9]/gu, '');
  const kind = KIND_OF[normal];
  if (kind === undefined) return null;
  return { kind, channel: channelMatch ? Number(channelMatch[1]) : null };
}

// Keys bench exports write that set nothing a case records, but mark a line as preamble.
const OTHER_KEYS = new Set(['recordlength', 'points', 'memorydepth', 'recordlen', 'length', 'triggerpoint', 'triggerlevel', 'triggertime', 'source', 'model', 'firmware', 'serial', 'date', 'time', 'label', 'mode', 'averages', 'pointformat', 'horizontalscale', 'horizontaloffset', 'timebase', 'holdoff', 'verticalposition', 'position', 'vertpos', 'hscale', 'hoffset']);

/** True for any key a preamble line may start with, understood or only kept. */
export function isPreambleKey(cell: string): boolean {
  if (readSettingKey(cell) !== null) return true;
  const channelMatch = CHANNEL.exec(cell);
  const rest = channelMatch ? cell.replace(channelMatch[0], ' ') : cell;
  return OTHER_KEYS.has(rest.toLowerCase().replace(/[^a-z0-9]/gu, ''));
}

/** A key read as a column of start/increment values (Rigol-like header cells). */
export function isParameterKey(cell: string): boolean {
  const setting = readSettingKey(cell);
  return setting !== null && (setting.kind === 'start' || setting.kind === 'interval');
}

interface Applied {
  value: number | string;
  key: string;
  text: string;
}

const ratio = /^(?:[x×]\s*(\d+(?:[.,]\d+)?)|(\d+(?:[.,]\d+)?)\s*(?:[x×]|:\s*1)?)$/iu;

/**
 * Collects the instrument settings from key–value lines, header parameter columns and
 * metadata columns, keeping every pair as written in `raw` and the ones it understands in SI.
 */
export class SettingsCollector {
  readonly raw: Record<string, string> = {};
  private readonly global = new Map<SettingKind, Applied>();
  private readonly perChannel = new Map<string, Applied>();
  readonly notes: string[] = [];

  constructor(private readonly decimalComma: () => boolean) {}

  add(key: string, value: string, unit = ''): void {
    key = key.trim().replace(/[:=]$/u, '').trim();
    value = value.trim();
    if (key === '' || value === '') return;
    const text = unit.trim() === '' ? value : `${value} ${unit.trim()}`;
    if (Object.keys(this.raw).length < 200 && !(key in this.raw)) this.raw[key] = text.slice(0, 200);
    const setting = readSettingKey(key);
    if (setting === null) return;
    const parsed = this.interpret(setting.kind, text);
    if (parsed === null) return;
    const applied = { value: parsed, key, text };
    if (setting.channel === null) {
      if (!this.global.has(setting.kind)) this.global.set(setting.kind, applied);
    } else {
      const slot = `${setting.channel}:${setting.kind}`;
      if (!this.perChannel.has(slot)) this.perChannel.set(slot, applied);
    }
  }

  /** The setting for a channel (by its number in names like "CH2"), else the file-wide one. */
  get(kind: SettingKind, channelNumber: number | null = null): Applied | undefined {
    if (channelNumber !== null) {
      const own = this.perChannel.get(`${channelNumber}:${kind}`);
      if (own) return own;
    }
    return this.global.get(kind);
  }

  number(kind: SettingKind, channelNumber: number | null = null): number | undefined {
    const value = this.get(kind, channelNumber)?.value;
    return typeof value === 'number' ? value : undefined;
  }

  /** The settings that matter to a case, for one channel, with a note saying where each came from. */
  metadataFor(channelNumber: number | null, notes: string[]): CaptureMetadata {
    const metadata: CaptureMetadata = { raw: { ...this.raw } };
    const said: string[] = [];
    const take = <K extends keyof CaptureMetadata>(field: K, kind: SettingKind, describe: (v: never) => string) => {
      const applied = this.get(kind, channelNumber);
      if (!applied) return;
      (metadata as unknown as Record<string, unknown>)[field] = applied.value;
      said.push(`${describe(applied.value as never)} ('${applied.key}' = '${applied.text}')`);
    };
    take('attenuationSetting', 'attenuation', (v: number) => `attenuation setting ${v}X`);
    take('voltsPerDiv', 'voltsPerDiv', (v: number) => `${v} V/div`);
    take('offsetV', 'offset', (v: number) => `offset ${v} V`);
    take('sampleRateHz', 'sampleRate', (v: number) => `sample rate ${v} Sa/s`);
    if (metadata.sampleRateHz === undefined) {
      const interval = this.number('interval', channelNumber);
      if (interval !== undefined && interval > 0) metadata.sampleRateHz = Number((1 / interval).toPrecision(12));
    }
    take('coupling', 'coupling', (v: string) => `${v.toUpperCase()} coupling`);
    take('bandwidthLimitHz', 'bandwidthLimit', (v: number) => `bandwidth limit ${v} Hz`);
    take('inputResistanceOhm', 'inputResistance', (v: number) => `input resistance ${v} Ω`);
    const coupling = this.get('coupling', channelNumber);
    if (coupling && metadata.inputResistanceOhm === undefined) {
      const fifty = /50/u.test(coupling.text);
      if (fifty) {
        metadata.inputResistanceOhm = 50;
        said.push(`input resistance 50 Ω (from the coupling '${coupling.text}')`);
      }
    }
    if (said.length > 0) notes.push(`Settings read from the file: ${said.join('; ')}.`);
    notes.push(...this.notes);
    return metadata;
  }

  private interpret(kind: SettingKind, text: string): number | string | null {
    const comma = this.decimalComma();
    const lower = text.toLowerCase().trim();
    switch (kind) {
      case 'attenuation': {
        const match = ratio.exec(lower.replace(/\s+/gu, ''));
        if (!match) return null;
        const value = Number((match[1] ?? match[2]).replace(',', '.'));
        return value > 0 ? value : null;
      }
      case 'coupling': {
        if (/^dc/u.test(lower)) return 'dc';
        if (/^ac/u.test(lower)) return 'ac';
        if (/^(gnd|ground)/u.test(lower)) this.notes.push(`The file says the channel was grounded ('${text}'); its trace shows no signal.`);
        return null;
      }
      case 'bandwidthLimit': {
        if (/^(off|full|none|no|false|disabled?)$/u.test(lower)) return null;
        if (/^(on|true|enabled?|yes)$/u.test(lower)) {
          this.notes.push(`The bandwidth limit is on ('${text}') but the file does not say at what frequency; not filled in.`);
          return null;
        }
        const q = readQuantity(text, comma);
        if (!q || !(q.value > 0) || !(q.unit === '' || q.unit === 'hz')) return null;
        return q.value;
      }
      case 'inputResistance': {
        if (/^(high|hi)[-\s]?z|^highz|^1\s*m(eg)?$|^onemeg/u.test(lower)) return 1e6;
        if (/^fifty/u.test(lower)) return 50;
        const q = readQuantity(text.replace(/ohms?/iu, 'ohm'), comma);
        if (!q || !(q.value > 0) || !['', 'ohm', 'ω', 'r'].includes(q.unit)) return null;
        return q.value;
      }
      case 'verticalUnit':
      case 'horizontalUnit': {
        const cell = readHeaderCell(text);
        if (cell.unit === null) return null;
        if (kind === 'verticalUnit' ? cell.role !== 'voltage' : cell.role !== 'time') return null;
        return cell.unitExp10;
      }
      default: {
        const q = readQuantity(text, comma);
        if (!q) return null;
        const okUnit: Record<string, string[]> = {
          voltsPerDiv: ['', 'v/div', 'v', 'volt', 'volts', 'v/div.', 'vperdiv'],
          offset: ['', 'v', 'volt', 'volts'],
          sampleRate: ['', 'sa/s', 'sps', 's/s', 'hz', 'samples/s', 'sa'],
          interval: ['', 's', 'sec', 'secs', 'seconds'],
          start: ['', 's', 'sec', 'secs', 'seconds'],
        };
        if (!(okUnit[kind] ?? ['']).includes(q.unit)) return null;
        if ((kind === 'voltsPerDiv' || kind === 'sampleRate' || kind === 'interval') && !(q.value > 0)) return null;
        return q.value;
      }
    }
  }
}
