import { describe, expect, it } from 'vitest';
import { navFor } from '../../src/app/nav';

const labels = (role: Parameters<typeof navFor>[0], localMail: boolean) => navFor(role, { localMail }).map((i) => i.label);

describe('main navigation', () => {
  it('should give each role its own screens', () => {
    expect(labels('engineer', true)).toEqual(['Bench', 'Cases', 'Diagnose', 'Lessons', 'Help']);
    expect(labels('moderator', true)).toContain('Review desk');
    expect(labels('moderator', true)).not.toContain('People');
    expect(labels('admin', true)).toEqual(expect.arrayContaining(['Review desk', 'People', 'Outbox']));
  });

  it('should offer the Outbox only while mails go to the local fake', () => {
    expect(labels('admin', false)).not.toContain('Outbox');
    expect(labels('admin', false)).toContain('People');
  });
});
