import { describe, expect, test } from 'vitest';
import { canonicalPath, isHomeownerVisitPath, isStaffApiPath, isStaffPagePath, needsSameOrigin } from './paths';

describe('canonicalPath', () => {
  // Source: RFC 3986 §5.4.2 (abnormal examples) and §5.2.4 (remove_dot_segments walk-through).
  test.each([
    ['/a/b/c/./../../g', '/a/g'],
    ['/b/c/../../../g', '/g'],
    ['/b/c/./g/.', '/b/c/g/'],
    ['/b/c/g/..', '/b/c/'],
    ['/b/c/g;x=1/./y', '/b/c/g;x=1/y'],
  ])('removes dot segments like RFC 3986: %s → %s', (path, canonical) => {
    expect(canonicalPath(path)).toBe(canonical);
  });

  // Source: RFC 3986 §2.3 and §6.2.2.2: escapes of unreserved characters (ALPHA, DIGIT, - . _ ~)
  // mean the character itself; other escapes (here %2F, the slash) keep their meaning.
  test.each([
    ['/%61pp', '/app'],
    ['/%41%2d%2E%5f%7E', '/A-._~'],
    ['/app%2Fleads', '/app%2Fleads'],
    ['/caf%C3%A9', '/caf%C3%A9'],
  ])('decodes only unreserved escapes: %s → %s', (path, canonical) => {
    expect(canonicalPath(path)).toBe(canonical);
  });

  test('collapses repeated slashes, so no spelling of a staff path escapes the guards', () => {
    for (const variant of ['//app', '///app', '/./app', '/app/../app', '/%61pp', '//api/app/team/invites', '/api//app/team/invites', '/%2e/app']) {
      const canonical = canonicalPath(variant);
      expect(isStaffPagePath(canonical) || isStaffApiPath(canonical), variant).toBe(true);
      expect(needsSameOrigin(canonical), variant).toBe(true);
    }
  });

  test('leaves canonical paths alone, trailing slashes included', () => {
    for (const path of ['/', '/app', '/app/', '/app/leads/0b5e1c9a-8a53-4d43-9f7e-1f0e2e6a5c11', '/embed/cedar-hollow', '/widget.js', '/reset/abc_DEF-123']) {
      expect(canonicalPath(path)).toBe(path);
    }
  });
});

describe('the homeowner’s visit link', () => {
  test('its page and routes need our own origin for writes, and are not the staff area', () => {
    for (const path of ['/visit/abc.def', '/api/visit/abc.def/move', '/api/visit/abc.def/cancel']) {
      expect(isHomeownerVisitPath(path), path).toBe(true);
      expect(needsSameOrigin(path), path).toBe(true);
      expect(isStaffPagePath(path) || isStaffApiPath(path), path).toBe(false);
    }
    for (const path of ['/visits', '/visitor', '/api/visitors', '/app/visits']) expect(isHomeownerVisitPath(path), path).toBe(false);
  });
});
