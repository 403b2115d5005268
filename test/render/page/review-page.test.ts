import { describe, expect, it } from 'vitest';
import { BOTTLING_PLANT_LOOPS } from '../../../src/demo/bottling-plant.js';
import { renderReviewPage } from '../../../src/render/page/review-page.js';
import { REVIEW_PAGE_SCRIPT } from '../../../src/render/page/review-page-script.js';

describe('renderReviewPage', () => {
  const html = renderReviewPage(BOTTLING_PLANT_LOOPS, '9.9.9');
  it('lists the demos and embeds them as JSON the script can read', () => {
    for (const d of BOTTLING_PLANT_LOOPS) expect(html).toContain(`<option value="${d.id}">`);
    const json = /<script type="application\/json" id="demo-data">([\s\S]*?)<\/script>/.exec(html)![1];
    expect(JSON.parse(json).map((d: { request: unknown }) => d.request)).toEqual(BOTTLING_PLANT_LOOPS.map((d) => d.request));
  });
  it('cannot be broken out of by a demo text containing </script>', () => {
    const evil = [{ ...BOTTLING_PLANT_LOOPS[0], title: '</script><b>x', description: '</script>' }];
    const page = renderReviewPage(evil, '1');
    expect(page.match(/<\/script>/g)!.length).toBe(2);
    expect(page).toContain('&lt;/script&gt;&lt;b&gt;x');
  });
  it('carries exactly one executable script, the one the CSP hash is made of', () => {
    const scripts = [...html.matchAll(/<script>([\s\S]*?)<\/script>/g)].map((m) => m[1]);
    expect(scripts).toEqual([REVIEW_PAGE_SCRIPT]);
    expect(html).toContain('loopgate 9.9.9');
  });
});
