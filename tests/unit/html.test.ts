import { describe, expect, it } from 'vitest';
import { escapeHtml } from '../../shared/html';

describe('escapeHtml', () => {
  it('replaces the five characters that matter in element text and quoted attributes', () => {
    // Character references as in the HTML standard (&amp; &lt; &gt; &quot; and the numeric &#39;).
    expect(escapeHtml(`<a href="x">Tom & Jerry's</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;Tom &amp; Jerry&#39;s&lt;/a&gt;');
    expect(escapeHtml('plain text, 20° at 03:00')).toBe('plain text, 20° at 03:00');
  });
});
