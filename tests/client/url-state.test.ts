import { describe, expect, it } from 'vitest';
import { applyParamChanges, pickParams, sameParams } from '../../src/lib/url-state';
import { isTypingTarget } from '../../src/components/keyboard/shortcuts';

describe('url-state', () => {
  it('should set, replace and remove keys, leaving the others alone', () => {
    const next = applyParamChanges(new URLSearchParams('q=ringing&cause=bandwidth&page=3'), { cause: 'ground-lead', q: '', tag: 'gate-drive' });
    expect(next.toString()).toBe('cause=ground-lead&page=3&tag=gate-drive');
  });

  it('should treat null, undefined and the empty string alike as "remove"', () => {
    const next = applyParamChanges(new URLSearchParams('a=1&b=2&c=3'), { a: null, b: undefined, c: '' });
    expect(next.toString()).toBe('');
  });

  it('should write numbers as their decimal text', () => {
    expect(applyParamChanges(new URLSearchParams(), { page: 2, pageSize: 50 }).toString()).toBe('page=2&pageSize=50');
  });

  it('should drop the named keys unless the changes set them (a new filter returns to page 1)', () => {
    const prev = new URLSearchParams('status=verified&page=4');
    expect(applyParamChanges(prev, { status: 'draft' }, { drop: ['page'] }).toString()).toBe('status=draft');
    expect(applyParamChanges(prev, { page: '5' }, { drop: ['page'] }).toString()).toBe('status=verified&page=5');
  });

  it('should start from nothing when told the changes are the whole state', () => {
    const next = applyParamChanges(new URLSearchParams('preset=x10-on-x1&signal.expectedAmplitudeV=3.3'), { 'probe.attenuation': 10 }, { fresh: true });
    expect(next.toString()).toBe('probe.attenuation=10');
  });

  it('should keep what was typed exactly, trailing space and symbols included', () => {
    const next = applyParamChanges(new URLSearchParams(), { q: 'reads ×0.1 at 3.3 V & rings ' });
    expect(new URLSearchParams(next.toString()).get('q')).toBe('reads ×0.1 at 3.3 V & rings ');
  });

  it('should leave the previous query untouched', () => {
    const prev = new URLSearchParams('q=a');
    applyParamChanges(prev, { q: 'b' });
    expect(prev.toString()).toBe('q=a');
  });

  it('should pick only the named, non-empty keys', () => {
    expect(pickParams(new URLSearchParams('q=droop&cause=&other=1&tag=probe'), ['q', 'cause', 'tag'] as const)).toEqual({ q: 'droop', tag: 'probe' });
  });

  it('should see two queries with the same keys in another order as the same state', () => {
    expect(sameParams(new URLSearchParams('a=1&b=2'), new URLSearchParams('b=2&a=1'))).toBe(true);
    expect(sameParams(new URLSearchParams('a=1'), new URLSearchParams('a=2'))).toBe(false);
  });
});

describe('keyboard shortcuts', () => {
  const el = (tag: string, extra: Partial<{ isContentEditable: boolean }> = {}) => ({ tagName: tag, isContentEditable: false, ...extra, closest: (sel: string) => (sel.split(',').some((s) => s.trim() === tag.toLowerCase()) ? {} : null) });

  it('should treat fields and editable text as typing, and anything else as a place for shortcuts', () => {
    expect(isTypingTarget(el('INPUT') as unknown as EventTarget)).toBe(true);
    expect(isTypingTarget(el('TEXTAREA') as unknown as EventTarget)).toBe(true);
    expect(isTypingTarget(el('SELECT') as unknown as EventTarget)).toBe(true);
    expect(isTypingTarget(el('DIV', { isContentEditable: true }) as unknown as EventTarget)).toBe(true);
    expect(isTypingTarget(el('A') as unknown as EventTarget)).toBe(false);
    expect(isTypingTarget(null)).toBe(false);
  });
});
