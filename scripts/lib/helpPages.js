// The add-in's help, rendered at build time: README.md becomes help.html (one anchor per
// function, as README's <a id> tags give them) and docs/support.md becomes support.html.
// Plain CommonJS so webpack.config.js can require it without a TypeScript loader.
const MarkdownIt = require('markdown-it');

/** Lower-case slug of a heading's text, for an id a link can scroll to. */
function slug(text) {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '');
}

function markdown() {
  // html: README carries <a id="…"></a> anchors for the function entries; the input is our own file.
  const md = new MarkdownIt({ html: true, linkify: false, typographer: false });
  const seen = new Set();
  md.core.ruler.push('heading_ids', (state) => {
    for (let i = 0; i < state.tokens.length; i++) {
      const token = state.tokens[i];
      if (token.type !== 'heading_open') continue;
      let id = slug(state.tokens[i + 1].content) || 'section';
      while (seen.has(id)) id += '-';
      seen.add(id);
      token.attrSet('id', id);
    }
  });
  // links between the two Markdown files point at their rendered pages
  const defaultLink = md.renderer.rules.link_open || ((tokens, idx, options, env, self) => self.renderToken(tokens, idx, options));
  md.renderer.rules.link_open = (tokens, idx, options, env, self) => {
    const href = tokens[idx].attrGet('href') || '';
    tokens[idx].attrSet('href', href.replace(/^(?:\.\/)?README\.md/, 'help.html').replace(/^(?:\.\/)?docs\/support\.md/, 'support.html').replace(/^(?:\.\/)?support\.md/, 'support.html'));
    return defaultLink(tokens, idx, options, env, self);
  };
  return md;
}

function page(title, body) {
  return [
    '<!doctype html>',
    '<html lang="en">',
    '<head>',
    '  <meta charset="utf-8">',
    '  <meta name="viewport" content="width=device-width, initial-scale=1">',
    "  <meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'self'; img-src 'self'; base-uri 'none'; form-action 'none'\">",
    `  <title>${title}</title>`,
    '  <link rel="stylesheet" href="help.css">',
    '</head>',
    '<body>',
    '  <nav><a href="help.html">Help</a> · <a href="support.html">Support</a></nav>',
    '  <main>',
    body,
    '  </main>',
    '</body>',
    '</html>',
    '',
  ].join('\n');
}

const CSS = `body { font: 15px/1.5 "Segoe UI", system-ui, -apple-system, sans-serif; margin: 0; color: #201f1e; background: #fff; }
nav { padding: 8px 16px; border-bottom: 1px solid #8a8886; }
main { max-width: 60rem; padding: 0 16px 50vh; }
code, pre { font-family: Consolas, "SF Mono", Menlo, monospace; font-size: 0.92em; }
pre { overflow-x: auto; padding: 8px; background: #f3f2f1; }
table { border-collapse: collapse; }
th, td { border: 1px solid #8a8886; padding: 4px 8px; vertical-align: top; text-align: left; }
a { color: #005a9e; }
p:has(> a:target), :target { background: #fff4ce; outline: 2px solid #8a6d00; }
@media (prefers-color-scheme: dark) {
  body { color: #f3f2f1; background: #1f1f1f; }
  pre { background: #2b2b2b; }
  a { color: #6cb8f6; }
  p:has(> a:target), :target { background: #3d3500; outline-color: #ffd335; }
}
`;

/**
 * The help files, as file name → content.
 * @param {string} readme README.md's text
 * @param {string} support docs/support.md's text
 */
function renderHelpPages(readme, support) {
  return {
    'help.html': page('Protic help', markdown().render(readme)),
    'support.html': page('Protic support', markdown().render(support)),
    'help.css': CSS,
  };
}

module.exports = { renderHelpPages, slug };
