import { z } from 'zod';
import type { UseFormReturn } from 'react-hook-form';
import { caseCreateSchema, statedCauseSchema, type CaseCreateInput } from '../../../../shared/schemas/case';
import { COUPLINGS, GENERATOR_LOADS, GROUND_KINDS, PROBE_KINDS, SIGNAL_KINDS } from '../../../../shared/schemas/diagnosis';
import { readQuantity, type QuantityUnit } from '../../../lib/quantity';

/** A quantity typed in engineering notation; blank means "not recorded" (null). */
const quantity = (unit: QuantityUnit) =>
  z.string().transform((text, ctx) => {
    const r = readQuantity(text, unit);
    if (r.kind === 'error') {
      ctx.addIssue({ code: 'custom', message: r.message });
      return z.NEVER;
    }
    return r.kind === 'ok' ? r.value : null;
  });

const blankOr = <T extends readonly [string, ...string[]]>(values: T) => z.union([z.literal(''), z.enum(values)]);
const orNull = (s: string) => (s.trim() === '' ? null : s.trim());
const yesNo = z.enum(['', 'yes', 'no']);
const readYesNo = (v: '' | 'yes' | 'no') => (v === '' ? null : v === 'yes');

/**
 * The editor's own shape: the shared case schema with every measured value as the text the
 * engineer typed, and selects as strings. The transform turns it into SI numbers and the pipe
 * hands it to the very schema the server parses, so both sides refuse the same things, and
 * each message lands on the field that caused it (the paths are the same).
 */
export const caseFormSchema = z
  .object({
    title: z.string(),
    summary: z.string(),
    narrative: z.string(),
    setup: z.object({
      probe: z.object({
        model: z.string(),
        nominalAttenuation: quantity('x'),
        switchable: z.boolean(),
        attenuation: quantity('x'),
        tipResistanceOhm: quantity('Ω'),
        tipCapacitanceF: quantity('F'),
        bandwidthHz: quantity('Hz'),
        groundKind: blankOr(GROUND_KINDS),
        groundLeadM: quantity('m'),
        groundWireRadiusM: quantity('m'),
        kind: blankOr(PROBE_KINDS),
        cmrrDb: quantity('dB'),
      }),
      scope: z.object({
        model: z.string(),
        attenuationSetting: quantity('x'),
        inputResistanceOhm: z.string(),
        inputCapacitanceF: quantity('F'),
        bandwidthHz: quantity('Hz'),
        bandwidthLimitOn: z.boolean(),
        bandwidthLimitHz: quantity('Hz'),
        riseTimeS: quantity('s'),
        coupling: blankOr(COUPLINGS),
        acCornerHz: quantity('Hz'),
        sampleRateHz: quantity('Sa/s'),
        voltsPerDiv: quantity('V/div'),
        offsetV: quantity('V'),
        divisions: quantity('#'),
      }),
      circuit: z.object({
        sourceResistanceOhm: quantity('Ω'),
        nodeDescription: z.string(),
        mainsConnected: yesNo,
        highestVoltageV: quantity('V'),
        loadResistanceOhm: quantity('Ω'),
        referenceV: quantity('V'),
        mainsFrequencyHz: quantity('Hz'),
      }),
      signal: z.object({
        kind: blankOr(SIGNAL_KINDS),
        expectedAmplitudeV: quantity('V'),
        frequencyHz: quantity('Hz'),
        riseTimeS: quantity('s'),
        baseV: quantity('V'),
        generatorLoad: blankOr(GENERATOR_LOADS),
      }),
      observed: z.object({
        amplitudeV: quantity('V'),
        riseTimeS: quantity('s'),
        overshootPct: quantity('%'),
        ringingFrequencyHz: quantity('Hz'),
        frequencyHz: quantity('Hz'),
        clipped: yesNo,
        tiltPct: quantity('%'),
        humFrequencyHz: quantity('Hz'),
        description: z.string(),
      }),
    }),
    statedCause: z.union([z.literal(''), statedCauseSchema]),
    statedCauseOther: z.string(),
    fix: z.string(),
    lessonSummary: z.string(),
    lessonDetail: z.string(),
    safetyNote: z.string(),
    tags: z.array(z.string()),
  })
  .transform((v): CaseCreateInput => {
    const { probe, scope, circuit, signal, observed } = v.setup;
    return {
      title: v.title,
      summary: v.summary,
      narrative: v.narrative,
      setup: {
        probe: {
          ...probe,
          model: orNull(probe.model),
          // a fixed-ratio probe's ratio in effect is its nominal one; only a switch can differ
          attenuation: probe.switchable ? probe.attenuation : null,
          groundKind: probe.groundKind || null,
          kind: probe.kind || null,
        },
        scope: {
          ...scope,
          model: orNull(scope.model),
          inputResistanceOhm: scope.inputResistanceOhm === '' ? null : Number(scope.inputResistanceOhm),
          bandwidthLimitHz: scope.bandwidthLimitOn ? scope.bandwidthLimitHz : null,
          coupling: scope.coupling || null,
          // the corner matters only on an AC-coupled channel
          acCornerHz: scope.coupling === 'ac' ? scope.acCornerHz : null,
        },
        circuit: {
          ...circuit,
          nodeDescription: orNull(circuit.nodeDescription),
          mainsConnected: readYesNo(circuit.mainsConnected),
        },
        signal: { ...signal, kind: signal.kind || null, generatorLoad: signal.generatorLoad || null },
        observed: { ...observed, clipped: readYesNo(observed.clipped), description: orNull(observed.description) },
      },
      statedCause: v.statedCause || null,
      statedCauseOther: v.statedCause === 'other' ? orNull(v.statedCauseOther) : null,
      fix: orNull(v.fix),
      lessonSummary: orNull(v.lessonSummary),
      lessonDetail: orNull(v.lessonDetail),
      safetyNote: orNull(v.safetyNote),
      tags: v.tags,
    };
  })
  .pipe(caseCreateSchema);

export type CaseFormValues = z.input<typeof caseFormSchema>;

/** The react-hook-form instance the editor sections share. */
export type CaseFormApi = UseFormReturn<CaseFormValues, unknown, CaseCreateInput>;
