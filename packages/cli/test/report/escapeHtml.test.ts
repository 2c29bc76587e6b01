import { describe, expect, it } from 'vitest';
import { escapeHtml } from '../../src/report/escapeHtml.js';

describe('escapeHtml(text)', () => {
  it('escapes the five characters that matter in content and quoted attributes', () => {
    expect(escapeHtml(`<b>&"x"'`)).toBe('&lt;b&gt;&amp;&quot;x&quot;&#39;');
    expect(escapeHtml('&amp;')).toBe('&amp;amp;');
    expect(escapeHtml(12)).toBe('12');
  });
});
