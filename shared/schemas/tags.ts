import { z } from 'zod';
import { tagSchema } from './case';
import { stripControlChars } from './clean-text';

export const tagRenameSchema = z.object({ to: tagSchema });
export const tagMergeSchema = z.object({ into: tagSchema });
export const tagSynonymsSchema = z.object({ synonyms: z.array(z.string().overwrite(stripControlChars).trim().toLowerCase().min(1).max(60)).max(30, 'At most 30 synonyms') });
export const tagRetireSchema = z.object({ retired: z.boolean({ error: 'retired must be true or false' }) });

export interface TagInfo {
  tag: string;
  count: number;
  synonyms: string[];
  retired: boolean;
  description: string | null;
}
