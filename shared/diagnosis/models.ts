import type { Candidate, ModelContext } from './types';
import { assessAttenuation } from './attenuation-mismatch';
import { assessTermination } from './termination-mismatch';
import { assessLoading } from './loading';
import { assessBandwidth } from './bandwidth';
import { assessCompensation } from './compensation';
import { assessGroundLead } from './ground-lead';
import { assessAliasing } from './aliasing';
import { assessClipping } from './clipping';
import { assessAcCoupling } from './ac-coupling';
import { assessCommonMode } from './common-mode';
import { assessMainsPickup } from './mains-pickup';
import { assessGeneratorLoad } from './generator-load';

/** Every cause model the ranker runs; each returns its recorded and fitted candidates. */
export const MODELS: ((ctx: ModelContext) => Candidate[])[] = [
  assessAttenuation,
  assessTermination,
  assessLoading,
  assessBandwidth,
  assessCompensation,
  assessGroundLead,
  assessAliasing,
  assessClipping,
  assessAcCoupling,
  assessCommonMode,
  assessMainsPickup,
  assessGeneratorLoad,
];
