/**
 * A strict well-formedness check for the XML the service writes (XML 1.0 §2.1 "well-formed":
 * one root, properly nested and closed elements, quoted and unique attributes, only the five
 * predefined or numeric entity references, no '<' in text or attribute values). No DTDs,
 * comments or processing instructions are expected in our output, so they are rejected too.
 * Returns the element tree.
 */
export interface XmlElement {
  readonly name: string;
  readonly attributes: Record<string, string>;
  readonly children: XmlElement[];
  text: string;
}

const NAME = /^[A-Za-z_:][A-Za-z0-9_:.-]*/;
const ENTITY = /^&(amp|lt|gt|quot|apos|#[0-9]+|#x[0-9A-Fa-f]+);/;

export function parseXml(source: string): XmlElement {
  let i = 0;
  const stack: XmlElement[] = [];
  let root: XmlElement | null = null;
  const fail = (message: string): never => {
    throw new Error(`not well-formed XML at ${i}: ${message} near ${JSON.stringify(source.slice(Math.max(0, i - 30), i + 30))}`);
  };
  const checkText = (text: string): string => {
    for (let k = 0; k < text.length; k++) {
      if (text[k] === '<') fail("'<' in text");
      if (text[k] === '&' && !ENTITY.test(text.slice(k))) fail("bare '&'");
    }
    return text;
  };
  while (i < source.length) {
    if (source[i] !== '<') {
      const end = source.indexOf('<', i);
      const text = source.slice(i, end < 0 ? source.length : end);
      if (stack.length === 0 && text.trim() !== '') fail('text outside the root element');
      if (stack.length > 0) stack[stack.length - 1].text += checkText(text);
      i = end < 0 ? source.length : end;
      continue;
    }
    if (source.startsWith('</', i)) {
      i += 2;
      const name = NAME.exec(source.slice(i))?.[0] ?? fail('missing end-tag name');
      i += name.length;
      while (/\s/.test(source[i])) i++;
      if (source[i] !== '>') fail('malformed end tag');
      i++;
      const open = stack.pop() ?? fail(`end tag </${name}> without a start tag`);
      if (open.name !== name) fail(`</${name}> closes <${open.name}>`);
      continue;
    }
    i++;
    const name = NAME.exec(source.slice(i))?.[0] ?? fail('missing tag name');
    i += name.length;
    const element: XmlElement = { name, attributes: {}, children: [], text: '' };
    for (;;) {
      const hadSpace = /\s/.test(source[i]);
      while (/\s/.test(source[i])) i++;
      if (source.startsWith('/>', i) || source[i] === '>') break;
      if (!hadSpace) fail('attributes must be separated by white space');
      const attr = NAME.exec(source.slice(i))?.[0] ?? fail('bad attribute name');
      i += attr.length;
      if (source[i] !== '=') fail(`attribute ${attr} without a value`);
      i++;
      const quote = source[i];
      if (quote !== '"' && quote !== "'") fail(`unquoted value of ${attr}`);
      const close = source.indexOf(quote, i + 1);
      if (close < 0) fail('unterminated attribute value');
      if (attr in element.attributes) fail(`duplicate attribute ${attr}`);
      element.attributes[attr] = checkText(source.slice(i + 1, close));
      i = close + 1;
    }
    const selfClosing = source.startsWith('/>', i);
    i += selfClosing ? 2 : 1;
    if (stack.length > 0) stack[stack.length - 1].children.push(element);
    else if (root === null) root = element;
    else fail('more than one root element');
    if (!selfClosing) stack.push(element);
  }
  if (stack.length > 0) fail(`<${stack[stack.length - 1].name}> is never closed`);
  return root ?? fail('no root element');
}

/** Every element named `name` in the tree (document order). */
export function elementsNamed(root: XmlElement, name: string): XmlElement[] {
  const out: XmlElement[] = [];
  const walk = (e: XmlElement): void => {
    if (e.name === name) out.push(e);
    e.children.forEach(walk);
  };
  walk(root);
  return out;
}
