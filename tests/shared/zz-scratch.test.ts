import { it } from 'vitest';
import { diagnose } from '../../shared/diagnosis/ranker';
it('x', () => {
  const show = (name: string, input: any) => {
    const r = diagnose(input);
    console.log(name, r.verdict, JSON.stringify(r.hypotheses.slice(0, 4).map((h) => [h.causes.join('+'), +h.likelihood.toFixed(3), +h.residual.toFixed(3), h.fits, h.predicted])), r.tags, r.risks.map(x=>x.id));
  };
  show('term10MHz', { probe: { attenuation: 10 }, scope: { attenuationSetting: 10, inputResistanceOhm: 50 }, circuit: { sourceResistanceOhm: 0 }, signal: { expectedAmplitudeV: 1, frequencyHz: 10e6, kind: 'sine' } });
  show('consistent', { probe: { attenuation: 10, groundKind: 'spring' }, scope: { attenuationSetting: 10, bandwidthHz: 500e6 }, signal: { expectedAmplitudeV: 1, frequencyHz: 10e6, kind: 'square' }, observed: { amplitudeV: 1, riseTimeS: 0.35 / 500e6 } });
  show('dc1.7', { probe: { attenuation: 10, groundKind: 'spring' }, scope: { attenuationSetting: 10, inputResistanceOhm: 1e6 }, signal: { expectedAmplitudeV: 2, kind: 'dc' }, observed: { amplitudeV: 3.4 } });
  show('spring40', { probe: { attenuation: 10, groundKind: 'spring', groundLeadM: 0.01 }, scope: { attenuationSetting: 10, bandwidthHz: 500e6 }, signal: { expectedAmplitudeV: 1, frequencyHz: 1e6 }, observed: { amplitudeV: 1, ringingFrequencyHz: 40e6 } });
  show('21Hz', { probe: { attenuation: 10 }, signal: { expectedAmplitudeV: 1, frequencyHz: 1 }, observed: { ringingFrequencyHz: 21 } });
  show('combo', { probe: { attenuation: 10, groundLeadM: 0.15 }, scope: { attenuationSetting: 1, bandwidthHz: 500e6 }, circuit: { sourceResistanceOhm: 25 }, signal: { expectedAmplitudeV: 1, frequencyHz: 1e6, kind: 'square' }, observed: { amplitudeV: 0.1, ringingFrequencyHz: 110e6 } });
  show('comp8', { probe: { attenuation: 10, groundKind: 'spring' }, scope: { attenuationSetting: 10, bandwidthHz: 500e6 }, signal: { expectedAmplitudeV: 1, frequencyHz: 12e6, kind: 'square' }, observed: { amplitudeV: 1.08, overshootPct: 0 } });
  show('nothing', { probe: { attenuation: 10, groundLeadM: 0.15 }, scope: { attenuationSetting: 1 }, signal: { expectedAmplitudeV: 1, frequencyHz: 1e6 } });
  show('empty', {});
  show('switch1x', { probe: { attenuation: 10 }, scope: { attenuationSetting: 10, bandwidthHz: 200e6 }, circuit: { sourceResistanceOhm: 1000 }, signal: { expectedAmplitudeV: 1, frequencyHz: 100e3, kind: 'square', riseTimeS: 5e-9 }, observed: { amplitudeV: 10, riseTimeS: 2.2*1000*100e-12 } });
});
