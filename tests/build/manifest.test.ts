import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';

// Manifest rules checked here are from the add-in only manifest reference
// (learn.microsoft.com/javascript/api/manifest: Runtime, CustomFunctions
// extension point, resid at most 32 characters) and "Configure your Office
// Add-in to use a shared runtime" (one resid for Runtime, Page and FunctionFile).
const text = readFileSync(fileURLToPath(new URL('../../manifest.xml', import.meta.url)), 'utf8');
const parsed = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@', removeNSPrefix: false, isArray: (name) => ['bt:Url', 'bt:String', 'bt:Image', 'Set', 'Control'].includes(name) }).parse(text);
const app = parsed.OfficeApp;
const host = app.VersionOverrides.Hosts.Host;
const resources = app.VersionOverrides.Resources;
const urls = new Map<string, string>(resources['bt:Urls']['bt:Url'].map((u: Record<string, string>) => [u['@id'], u['@DefaultValue']]));
const strings = new Map<string, string>([...resources['bt:ShortStrings']['bt:String'], ...resources['bt:LongStrings']['bt:String']].map((s: Record<string, string>) => [s['@id'], s['@DefaultValue']]));
const images = new Map<string, string>(resources['bt:Images']['bt:Image'].map((s: Record<string, string>) => [s['@id'], s['@DefaultValue']]));

describe('manifest.xml', () => {
  it('is well-formed XML', () => {
    expect(XMLValidator.validate(text)).toBe(true);
  });

  it('is a task pane add-in for workbooks named Spotloom', () => {
    expect(app['@xsi:type']).toBe('TaskPaneApp');
    expect(app.Id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(app.DisplayName['@DefaultValue']).toBe('Spotloom');
    expect(app.Hosts.Host['@Name']).toBe('Workbook');
    expect(app.DefaultSettings.SourceLocation['@DefaultValue']).toBe('https://localhost:3000/taskpane.html');
  });

  it('asks for the shared runtime: SharedRuntime 1.1 and one long-lived Runtime', () => {
    expect(app.Requirements.Sets.Set).toContainEqual({ '@Name': 'SharedRuntime', '@MinVersion': '1.1' });
    expect(host['@xsi:type']).toBe('Workbook');
    expect(host.Runtimes.Runtime['@lifetime']).toBe('long');
    expect(Object.keys(host)[0]).toBe('Runtimes'); // it must come first in the Host element
  });

  it('hosts the pane and the functions on one page: Runtime, functions Page, FunctionFile and the pane button share a resid', () => {
    const page = host.Runtimes.Runtime['@resid'];
    const cf = host.AllFormFactors.ExtensionPoint;
    expect(cf['@xsi:type']).toBe('CustomFunctions');
    expect(cf.Page.SourceLocation['@resid']).toBe(page);
    expect(host.DesktopFormFactor.FunctionFile['@resid']).toBe(page);
    const button = host.DesktopFormFactor.ExtensionPoint.OfficeTab.Group.Control[0];
    expect(button.Action['@xsi:type']).toBe('ShowTaskpane');
    expect(button.Action.SourceLocation['@resid']).toBe(page);
    expect(urls.get(page)).toBe('https://localhost:3000/taskpane.html');
  });

  it('points the functions at functions.js and the generated functions.json, namespace LOOM', () => {
    const cf = host.AllFormFactors.ExtensionPoint;
    expect(urls.get(cf.Script.SourceLocation['@resid'])).toBe('https://localhost:3000/functions.js');
    expect(urls.get(cf.Metadata.SourceLocation['@resid'])).toBe('https://localhost:3000/functions.json');
    expect(strings.get(cf.Namespace['@resid'])).toBe('LOOM');
  });

  it('defines every resid it uses, each at most 32 characters, every address on https://localhost:3000', () => {
    const used = [...text.matchAll(/resid="([^"]+)"/g)].map((m) => m[1]);
    for (const id of used) {
      expect(urls.has(id) || strings.has(id) || images.has(id), id).toBe(true);
      expect(id.length, id).toBeLessThanOrEqual(32);
    }
    for (const url of [...text.matchAll(/DefaultValue="(https?:[^"]+)"/g)].map((m) => m[1])) expect(url).toMatch(/^https:\/\/localhost:3000\//);
  });
});
