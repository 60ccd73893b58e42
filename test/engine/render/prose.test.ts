import { describe, expect, it } from 'vitest';
import { parse } from 'node-html-parser';
import { renderProse } from '../../../engine/render/prose.js';

describe('renderProse(markdown)', () => {
  it('renderProse renders markdown and typesets $…$ and $$…$$ with KaTeX', () => {
    const html = renderProse('The span $L$ is **6 m**.\n\n$$H = \\frac{w L^2}{8 f}$$\n');
    expect(html).toContain('<strong>6 m</strong>');
    expect(html.match(/class="katex"/g)?.length).toBe(2);
    expect(html).toContain('class="katex-display"');
  });

  it('renderProse leaves dollar amounts and code spans alone', () => {
    const html = renderProse('It costs $5 and $10. Write `$x$` literally.');
    expect(html).not.toContain('katex');
    expect(html).toContain('<code>$x$</code>');
  });

  it('renderProse moves headings one level down (the title is the only h1)', () => {
    expect(renderProse('# One\n\n## Two')).toBe('<h2>One</h2>\n<h3>Two</h3>\n');
  });

  it('renderProse removes scripts, event handlers, javascript: URLs, styles and remote images', () => {
    const html = renderProse([
      '<script>alert(1)</script>', '<img src="x" onerror="alert(1)">', '<a href="javascript:alert(1)">a</a>',
      '<p style="background:url(http://evil.example/)">s</p>', '<img src="http://evil.example/i.png">',
      '<iframe src="http://evil.example/"></iframe>', '<svg onload="alert(1)"><circle/></svg>', '[b](javascript:alert(2))',
      '<form action="http://evil.example/"><input type="image" src="http://evil.example/b.png"></form>',
    ].join('\n\n'));
    const root = parse(html);
    expect(root.querySelectorAll('script, iframe, svg, form, style').length).toBe(0);
    for (const el of root.querySelectorAll('*')) {
      for (const name of Object.keys(el.attributes)) expect(name.startsWith('on'), name).toBe(false);
      expect(el.getAttribute('style')).toBeUndefined();
      expect(el.getAttribute('href') ?? '').not.toMatch(/^\s*javascript:/i);
      expect(el.getAttribute('src') ?? '').not.toMatch(/^\s*https?:/i);
    }
    expect(html).not.toMatch(/<[^>]*alert/); // no tag keeps an attribute that mentions it
  });

  it('renderProse keeps data: images, links and tables', () => {
    const html = renderProse('<img src="data:image/png;base64,AAAA" alt="sketch">\n\n[code](https://example.org)\n\n| a | b |\n|---|---|\n| 1 | 2 |');
    expect(html).toContain('src="data:image/png;base64,AAAA"');
    expect(html).toContain('href="https://example.org"');
    expect(parse(html).querySelectorAll('td').length).toBe(2);
  });

  it('renderProse cannot be made to put maths inside an attribute', () => {
    // The private-use placeholder characters are stripped from the input, so a crafted slot number goes nowhere.
    const html = renderProse('<a href="https://x.example/\uE0000\uE001" title="$x$">$y$</a> and $z$');
    const a = parse(html).querySelector('a')!;
    expect(a.getAttribute('href')).toBe('https://x.example/0');
    expect(a.getAttribute('title')).toBe('$x$');
  });

  it('renderProse renders KaTeX errors as text, not as an exception', () => {
    expect(() => renderProse('$\\frac{1}{$ and $\\href{javascript:alert(1)}{x}$')).not.toThrow();
    expect(renderProse('$\\href{javascript:alert(1)}{x}$')).not.toContain('href="javascript');
  });
});
