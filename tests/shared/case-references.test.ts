import { describe, expect, it } from 'vitest';
import { referencedCaseIds, renumberCaseReferences } from '../../shared/cases/case-references';

describe('renumbering #id links', () => {
  it('should renumber prose links only, and unlink the numbers it has no counterpart for', () => {
    const to = (id: number) => new Map([[3, 103], [4, 104]]).get(id);
    const text = 'See #3 and #4 (#5 too). Not `#3`, not [x](page#3), not http://h/#3, not &#3;.\n```\n#4\n```';
    const r = renumberCaseReferences(text, to);
    expect(r.text).toBe('See #103 and #104 (archive case 5 too). Not `#3`, not [x](page#3), not http://h/#3, not &#3;.\n```\n#4\n```');
    expect(r.unmatched).toEqual([5]);
    expect(referencedCaseIds(r.text)).toEqual([103, 104]);
  });
});
