import { describe, expect, it } from 'vitest';
import { escapeHtml, safeSvg, studyReportHtml } from '../../../src/core/export/study-report';

describe('studyReportHtml', () => {
  const html = studyReportHtml({
    title: 'Study <script>alert(1)</script>',
    appVersion: '1.2.3',
    createdAt: '2026-01-01T00:00:00Z',
    clusters: [
      { id: 1, name: 'a & b', className: 'walking', size: 12345, colour: '#e69f00', setAside: false, flags: ['subject-bound'] },
      { id: 2, name: '"x"', className: '', size: 3, colour: 'red;background:url(x)', setAside: true, flags: [] },
    ],
    metrics: [{ name: 'Mean silhouette', value: '0.43', meaning: '−1 to 1; higher = clusters further apart' }],
    facts: [{ name: 'Seed', value: '7' }],
    figures: [
      { title: 'Map', svg: '<svg xmlns="http://www.w3.org/2000/svg"><circle r="2"/></svg>' },
      { title: 'Bad', svg: '<svg onload="alert(1)"></svg>' },
    ],
    cautions: ['Research aid, not a diagnosis.'],
    provenance: { input: { sha256: 'ab' } },
  });

  it('escapes everything taken from the study, and has no scripts or external resources', () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).toContain('Study &lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('a &amp; b');
    expect(html).toContain('&quot;x&quot;');
    expect(html).not.toContain('url(x)');
    expect(html).not.toMatch(/https?:\/\/(?!www\.w3\.org\/2000\/svg)/);
  });

  it('holds the cluster table, metrics, cautions, provenance and the safe figures only', () => {
    expect(html).toContain('<circle r="2"/>');
    expect(html).not.toContain('onload');
    expect(html).toContain('figure left out');
    // Sizes with thousands separators; clusters by their number.
    expect(html).toContain('<td>walking</td><td class="num">12,345</td><td>subject-bound</td>');
    expect(html).toMatch(/<tr><td>1<\/td><td><span class="swatch"/);
    expect(html).toContain('set aside');
    // Figures rounded, with what they say; provenance as a table, the full JSON folded away.
    expect(html).toContain('<th scope="row">Mean silhouette</th><td class="num">0.43</td><td class="meaning">−1 to 1; higher = clusters further apart</td>');
    expect(html).toContain('<th scope="row">Seed</th><td>7</td>');
    expect(html).toMatch(/<details><summary>[^<]*JSON[^<]*<\/summary><pre>[^<]*&quot;sha256&quot;: &quot;ab&quot;/);
    expect(html).toContain('Research aid, not a diagnosis.');
  });

  it('escapeHtml and safeSvg', () => {
    expect(escapeHtml(`<a href='x'>&</a>`)).toBe('&lt;a href=&#39;x&#39;&gt;&amp;&lt;/a&gt;');
    expect(safeSvg('<svg><script>1</script></svg>')).toBeNull();
    expect(safeSvg('<svg><a href="javascript:1"/></svg>')).toBeNull();
    expect(safeSvg('<div></div>')).toBeNull();
  });
});
