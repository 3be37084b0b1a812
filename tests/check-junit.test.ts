// JUnit XML: checked with a small well-formedness reader written here (tags balanced,
// attributes quoted and unique, only the five predefined and numeric entities, no raw
// `<` or `&` in text, only XML 1.0 characters), which also decodes the text back.
import { describe, expect, it } from 'vitest';
import { junitXml, outcomeCases } from '../shared/check/junit.js';

interface XmlElement {
  name: string;
  attrs: Record<string, string>;
  children: XmlElement[];
  text: string;
}

const entities: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

function decode(s: string): string {
  if (/&(?!(amp|lt|gt|quot|apos|#\d+|#x[0-9a-fA-F]+);)/.test(s)) throw new Error(`bad entity in ${JSON.stringify(s)}`);
  return s.replace(/&(#x[0-9a-fA-F]+|#\d+|\w+);/g, (_, e: string) =>
    e.startsWith('#x') ? String.fromCodePoint(parseInt(e.slice(2), 16)) : e.startsWith('#') ? String.fromCodePoint(Number(e.slice(1))) : entities[e],
  );
}

function parseXml(xml: string): XmlElement {
  if (/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/.test(xml)) throw new Error('character not allowed in XML 1.0');
  const body = xml.replace(/^<\?xml version="1\.0" encoding="UTF-8"\?>\n/, '');
  if (body === xml) throw new Error('missing XML declaration');
  const token = /<(\/?)([A-Za-z_][\w.-]*)((?:\s+[A-Za-z_][\w.-]*="[^"<]*")*)\s*(\/?)>|([^<]+)/gy;
  const root: XmlElement = { name: '#root', attrs: {}, children: [], text: '' };
  const stack = [root];
  let m: RegExpExecArray | null;
  let pos = 0;
  while ((m = token.exec(body))) {
    pos = token.lastIndex;
    const [, close, name, attrText, selfClose, text] = m;
    const top = stack[stack.length - 1];
    if (text !== undefined) {
      if (stack.length === 1 && text.trim()) throw new Error('text outside the root element');
      top.text += decode(text);
      continue;
    }
    if (close) {
      if (top.name !== name) throw new Error(`</${name}> closes <${top.name}>`);
      stack.pop();
      continue;
    }
    const attrs: Record<string, string> = {};
    for (const a of attrText.matchAll(/([A-Za-z_][\w.-]*)="([^"]*)"/g)) {
      if (a[1] in attrs) throw new Error(`duplicate attribute ${a[1]}`);
      attrs[a[1]] = decode(a[2]);
    }
    const el: XmlElement = { name, attrs, children: [], text: '' };
    top.children.push(el);
    if (!selfClose) stack.push(el);
  }
  if (pos !== body.length) throw new Error(`not well-formed at offset ${pos}: ${JSON.stringify(body.slice(pos, pos + 20))}`);
  if (stack.length !== 1) throw new Error(`unclosed <${stack[stack.length - 1].name}>`);
  if (root.children.length !== 1) throw new Error('expected one root element');
  return root.children[0];
}

describe('the well-formedness reader', () => {
  it('rejects broken XML (so the checks below can fail)', () => {
    const decl = '<?xml version="1.0" encoding="UTF-8"?>\n';
    expect(() => parseXml(`${decl}<a><b></a>`)).toThrow();
    expect(() => parseXml(`${decl}<a x="1 < 2"/>`)).toThrow();
    expect(() => parseXml(`${decl}<a>fish & chips</a>`)).toThrow();
    expect(() => parseXml(`${decl}<a x="1" x="2"/>`)).toThrow();
    expect(() => parseXml(`${decl}<a>\u0001</a>`)).toThrow();
    expect(parseXml(`${decl}<a x="&quot;"><b>1 &lt; 2</b></a>`).children[0].text).toBe('1 < 2');
  });
});

describe('junitXml', () => {
  const nasty = 'Nu drifted: <b> & "quoted" \'single\'\nsecond line\twith tab ]]> end\r\n';

  it('writes suites and cases with counts, and escapes everything', () => {
    const xml = junitXml([
      {
        name: 'studies/pipe.yaml',
        cases: [
          { name: 'line 12: gnielinski at Re=1e5, Pr=5: Nu', classname: 'checks', time: 0.25 },
          { name: 'baseline: <dittus-boelter> & co', classname: 'baseline "pipe"', failure: nasty },
        ],
      },
      { name: 'studies/empty.yaml', cases: [] },
    ]);
    const root = parseXml(xml);
    expect(root.name).toBe('testsuites');
    expect(root.attrs).toMatchObject({ tests: '2', failures: '1', errors: '0', time: '0.250' });
    const [pipe, empty] = root.children;
    expect(pipe.attrs).toMatchObject({ name: 'studies/pipe.yaml', tests: '2', failures: '1' });
    expect(empty.attrs).toMatchObject({ tests: '0', failures: '0' });
    const [ok, bad] = pipe.children;
    expect(ok).toMatchObject({ name: 'testcase', children: [] });
    expect(ok.attrs).toEqual({ name: 'line 12: gnielinski at Re=1e5, Pr=5: Nu', classname: 'checks', time: '0.250' });
    expect(bad.attrs.name).toBe('baseline: <dittus-boelter> & co');
    expect(bad.attrs.classname).toBe('baseline "pipe"');
    const failure = bad.children[0];
    expect(failure.name).toBe('failure');
    expect(failure.attrs.message).toBe('Nu drifted: <b> & "quoted" \'single\'');
    expect(failure.text).toBe(nasty);
    // A raw CR would be turned into LF by a conforming parser, so it travels as a reference.
    expect(xml).toContain('end&#13;\n</failure>');
  });

  it('keeps line breaks in attributes and replaces characters XML cannot carry', () => {
    const xml = junitXml([{ name: 'multi\nline\r\tname', cases: [{ name: 'bell\u0007 and lone \uD800 surrogate', classname: 'c', failure: 'x\u0000y' }] }]);
    const root = parseXml(xml);
    expect(root.children[0].attrs.name).toBe('multi\nline\r\tname');
    const tc = root.children[0].children[0];
    expect(tc.attrs.name).toBe('bell\uFFFD and lone \uFFFD surrogate');
    expect(tc.children[0].text).toBe('x\uFFFDy');
    // A valid surrogate pair (an emoji) passes through.
    expect(parseXml(junitXml([{ name: 'ok 😀', cases: [] }])).children[0].attrs.name).toBe('ok 😀');
  });

  it('turns outcomes into cases', () => {
    const cases = outcomeCases(
      [
        { name: 'a', passed: true, message: 'fine' },
        { name: 'b', passed: false, message: 'broken' },
      ],
      'studies/x.yaml',
    );
    expect(cases).toEqual([
      { name: 'a', classname: 'studies/x.yaml', failure: undefined },
      { name: 'b', classname: 'studies/x.yaml', failure: 'broken' },
    ]);
    const root = parseXml(junitXml([{ name: 's', cases }]));
    expect(root.attrs.failures).toBe('1');
  });
});
