import { describe, expect, it } from 'vitest';
import { parseRoute, routeHref } from '../../src/ui/router';

describe('reading the address of a screen', () => {
  it('reads every screen and its parts back from the address it writes', () => {
    expect(parseRoute(routeHref('day', 'a1', 'series', 'b2'))).toEqual({ screen: 'day', params: ['a1', 'series', 'b2'] });
    expect(parseRoute(routeHref('specimens', 'steel ball/25 mm'))).toEqual({ screen: 'specimens', params: ['steel ball/25 mm'] });
    expect(parseRoute('#/settings')).toEqual({ screen: 'settings', params: [] });
  });

  it('opens the day, without a complaint, for an empty address', () => {
    for (const hash of ['', '#', '#/', '#//']) expect(parseRoute(hash)).toEqual({ screen: 'day', params: [] });
  });

  // A link cut in the middle of a percent escape, a path that climbs, a screen that does not exist, an address
  // far longer than any the app writes: each opens the day with the reason, never an exception (which left the
  // app blank at a cold start).
  it.each([
    ['a cut percent escape', '#/day/%E0%A4%A', 'malformed'],
    ['a lone percent sign', '#/specimens/100%', 'malformed'],
    ['an escaped lone surrogate', '#/day/%ED%A0%80', 'malformed'],
    ['a screen that does not exist', '#/series/../../', 'unknown'],
    ['a name inherited by every object', '#/constructor', 'unknown'],
    ['an address of 100 000 characters', `#/day/${'a'.repeat(100_000)}`, 'too-long'],
  ])('opens the day and says the address leads nowhere for %s', (_name, hash, reason) => {
    expect(parseRoute(hash)).toEqual({ screen: 'day', params: [], notFound: reason });
  });
});
