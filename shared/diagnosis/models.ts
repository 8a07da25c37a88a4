import type { Candidate, ModelContext } from './types';
import { assessAttenuation } from './attenuation-mismatch';
import { assessTermination } from './termination-mismatch';
import { assessLoading } from './loading';
import { assessBandwidth } from './bandwidth';
import { assessCompensation } from './compensation';
import { assessGroundLead } from './ground-lead';

/** Every cause model the ranker runs; each returns its recorded and fitted candidates. */
export const MODELS: ((ctx: ModelContext) => Candidate[])[] = [
  assessAttenuation,
  assessTermination,
  assessLoading,
  assessBandwidth,
  assessCompensation,
  assessGroundLead,
];
