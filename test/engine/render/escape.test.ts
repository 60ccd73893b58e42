import { describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { anchorId, cssString, escapeHtml, texText } from '../../../engine/render/escape.js';
import { sha256Hex } from '../../../engine/render/sha256.js';

describe('escaping', () => {
  it('escapeHtml(text) leaves no character that can open a tag or end an attribute', () => {
    fc.assert(fc.property(fc.string(), (s) => {
      const out = escapeHtml(s);
      expect(out).not.toMatch(/[<>"']/);
      expect(out.replace(/&(amp|lt|gt|quot|#39);/g, '')).not.toContain('&');
    }));
  });

  it('cssString(text) cannot end the string, the rule or the style element', () => {
    fc.assert(fc.property(fc.string(), (s) => {
      const out = cssString(s);
      const inner = out.slice(1, -1);
      expect(out.startsWith('"') && out.endsWith('"')).toBe(true);
      expect(inner).not.toMatch(/["<>\n\r\\](?![0-9a-f]+ )/);
    }));
    expect(cssString('a"b</style>')).toBe('"a\\22 b\\3c /style\\3e "');
  });

  it('texText(text) escapes every TeX special character', () => {
    expect(texText('a_b {x} $5 & #1 ^ % ~ \\')).toBe('a\\_b \\{x\\} \\$5 \\& \\#1 \\textasciicircum{} \\% \\textasciitilde{} \\textbackslash{}');
  });

  it('anchorId(cellId) keeps only safe characters', () => {
    expect(anchorId('check@L30')).toBe('cell-check-L30');
    expect(anchorId('H_min')).toBe('cell-H_min');
  });
});

describe('sha256Hex(text)', () => {
  // Test vectors from FIPS 180-4 examples (NIST CSRC "SHA256.pdf" example values).
  it('sha256Hex matches the published vectors', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
  });

  it('sha256Hex agrees with node:crypto on any text, including multi-byte characters and block boundaries', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 300 }), (s) => {
      expect(sha256Hex(s)).toBe(createHash('sha256').update(s, 'utf8').digest('hex'));
    }), { numRuns: 200 });
  });
});
