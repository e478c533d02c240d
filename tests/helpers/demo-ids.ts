import type { Page } from 'playwright-core';

/** The first mapping of the first molecule of the signed-in person's first project (the demo's), asked of the API in the page. */
export function firstMappingId(page: Page): Promise<number> {
  return page.evaluate(async () => {
    const projects = await (await fetch('/api/projects')).json();
    const molecules = await (await fetch(`/api/projects/${projects[0].id}/molecules`)).json();
    const mappings = await (await fetch(`/api/molecules/${molecules[0].id}/mappings`)).json();
    return mappings[0].id as number;
  });
}
