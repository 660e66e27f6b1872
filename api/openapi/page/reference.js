// Renders /api/openapi.json as a readable page: operations grouped by tag, each with who may call it,
// its parameters, request body and answer schemas. Plain DOM, no dependencies; served same-origin (CSP).
(async () => {
  const intro = document.getElementById('intro');
  const list = document.getElementById('operations');
  const el = (tag, text, cls) => {
    const node = document.createElement(tag);
    if (text !== undefined) node.textContent = text;
    if (cls) node.className = cls;
    return node;
  };
  const block = (title, value) => {
    const wrap = el('div');
    wrap.append(el('strong', title));
    wrap.append(el('pre', JSON.stringify(value, null, 2)));
    return wrap;
  };
  try {
    const doc = await (await fetch('/api/openapi.json', { credentials: 'same-origin' })).json();
    intro.textContent = `${doc.info.title} (OpenAPI ${doc.openapi}). ${doc.info.description}`;
    const byTag = new Map();
    for (const [path, item] of Object.entries(doc.paths)) {
      for (const [method, op] of Object.entries(item)) {
        const tag = op.tags[0];
        if (!byTag.has(tag)) byTag.set(tag, []);
        byTag.get(tag).push({ path, method, op });
      }
    }
    for (const [tag, ops] of byTag) {
      list.append(el('h2', tag));
      for (const { path, method, op } of ops) {
        const details = el('details');
        const summary = el('summary');
        summary.append(el('span', method.toUpperCase(), 'method'), el('code', path), document.createTextNode(` — ${op.summary}`));
        details.append(summary);
        const body = el('div', undefined, 'body');
        body.append(el('p', op.description));
        if (op.parameters.length) body.append(block('Parameters', op.parameters));
        if (op.requestBody) body.append(block('Request body', op.requestBody.content));
        body.append(block('Answers', op.responses));
        details.append(body);
        list.append(details);
      }
    }
  } catch (error) {
    intro.textContent = `The API description could not be loaded: ${error}`;
  }
})();
