// Bring a node on screen in line with a freshly built one, touching only what differs: the same
// element kind in the same place keeps its node and gets the new attributes and text; anything
// else is replaced. A panel redrawn this way after each edit costs the browser style, layout
// and paint for the parts that moved, not for all of it. Event listeners are not copied: the
// nodes patched this way carry none (see chartsPanel.ts).

function sameKind(a: Node, b: Node): boolean {
  return (
    a.nodeType === b.nodeType &&
    a.nodeName === b.nodeName &&
    (a as Element).namespaceURI === (b as Element).namespaceURI
  );
}

function patchAttributes(live: Element, fresh: Element): void {
  for (const name of live.getAttributeNames()) if (!fresh.hasAttribute(name)) live.removeAttribute(name);
  for (const name of fresh.getAttributeNames()) {
    const value = fresh.getAttribute(name) as string;
    if (live.getAttribute(name) !== value) live.setAttribute(name, value);
  }
}

/** Make the children of `live` equal to those of `fresh` (which is emptied: its nodes may move over). */
export function patchChildren(live: Node, fresh: Node): void {
  const wanted = [...fresh.childNodes];
  wanted.forEach((next, i) => {
    const cur = live.childNodes[i];
    if (!cur) live.appendChild(next);
    else if (!sameKind(cur, next)) live.replaceChild(next, cur);
    else if (cur.nodeType === Node.ELEMENT_NODE) {
      patchAttributes(cur as Element, next as Element);
      patchChildren(cur, next);
    } else if (cur.nodeValue !== next.nodeValue) cur.nodeValue = next.nodeValue;
  });
  while (live.childNodes.length > wanted.length) live.lastChild?.remove();
}
