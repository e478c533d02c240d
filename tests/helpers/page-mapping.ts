import type { Page } from 'playwright-core';

/** A new molecule (from SMILES) with an empty mapping in the signed-in person's first project, made through the API in the page. */
export function newMappingInPage(page: Page, input: { molecule: string; smiles: string; mapping: string; resolution: string }): Promise<{ projectId: number; moleculeId: number; mappingId: number; model: { atoms: { aromatic: boolean }[]; bonds: { a: number; b: number }[] } }> {
  return page.evaluate(async ({ molecule: name, smiles, mapping: mappingName, resolution }) => {
    const { token } = await (await fetch('/api/auth/csrf')).json();
    const post = async (path: string, body: unknown) => {
      const res = await fetch(path, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify(body) });
      if (!res.ok) throw new Error(`${path}: ${res.status} ${await res.text()}`);
      return res.json();
    };
    const projects = await (await fetch('/api/projects')).json();
    const molecule = await post(`/api/projects/${projects[0].id}/molecules`, { name, smiles });
    const mapping = await post(`/api/molecules/${molecule.id}/mappings`, { name: mappingName, resolution });
    const { model } = await (await fetch(`/api/molecules/${molecule.id}`)).json();
    return { projectId: projects[0].id as number, moleculeId: molecule.id as number, mappingId: mapping.id as number, model };
  }, input);
}
