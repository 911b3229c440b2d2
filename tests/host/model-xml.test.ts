import { describe, expect, it } from 'vitest';
import { MODEL_XML_NAMESPACE, modelXml, readModelXml } from '../../src/host/model-xml';
import { XMLValidator } from 'fast-xml-parser';

describe('model-xml', () => {
  it('modelXml(name, text) is well-formed XML that reads back to the same name and text', () => {
    const text = JSON.stringify({ note: 'a < b & "c" \'d\' > e', u: '\uFFFE\u00e9\u{1F600}' });
    const xml = modelXml("week's <best>", text);
    expect(XMLValidator.validate(xml)).toBe(true);
    const back = readModelXml(xml)!;
    expect(back.name).toBe("week's <best>");
    // U+FFFE is not an XML character: it travels as a JSON escape, with the same meaning
    expect(JSON.parse(back.text)).toEqual(JSON.parse(text));
  });

  it('readModelXml accepts what a host may add when it writes the part back', () => {
    const xml = `<?xml version="1.0" encoding="utf-8"?>\n<!-- saved -->\n<m:spotloomModel xmlns:m="${MODEL_XML_NAMESPACE}" name='a'>{&quot;x&quot;:&#60;1<![CDATA[&]]>&#x3E;}</m:spotloomModel>`;
    expect(readModelXml(xml)).toEqual({ name: 'a', text: '{"x":<1&>}' });
  });

  it('readModelXml ignores parts of other namespaces or shapes', () => {
    expect(readModelXml(`<spotloomModel xmlns="urn:other" name="a">{}</spotloomModel>`)).toBeUndefined();
    expect(readModelXml(`<spotloomModel xmlns="${MODEL_XML_NAMESPACE}">{}</spotloomModel>`)).toBeUndefined();
    expect(readModelXml(`<spotloomModel xmlns="${MODEL_XML_NAMESPACE}" name="a"><x/></spotloomModel>`)).toBeUndefined();
    expect(readModelXml(`<spotloomModel xmlns="${MODEL_XML_NAMESPACE}" name="a">&bogus;</spotloomModel>`)).toBeUndefined();
    expect(readModelXml(`<spotloomModel xmlns="${MODEL_XML_NAMESPACE}" name="a">&#0;</spotloomModel>`)).toBeUndefined();
    expect(readModelXml('not xml')).toBeUndefined();
  });

  it('modelXml refuses control characters XML cannot carry', () => {
    expect(() => modelXml('a', 'x\u0001y')).toThrow(/control characters/);
  });
});
