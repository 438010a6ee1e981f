import type { APIRequestContext } from '@playwright/test';

/** Opens the embed page as a browser would and returns the signed form token it hands the widget. */
export async function formTokenFor(request: APIRequestContext, slug: string): Promise<string> {
  const html = await (await request.get(`/embed/${slug}`)).text();
  // Astro serialises island props into an HTML attribute: "formToken":[0,"…"].
  const props = html.replace(/&quot;/g, '"');
  const match = props.match(/"formToken":\[0,"([^"]+)"\]/);
  if (!match) throw new Error(`No form token on /embed/${slug}`);
  return match[1]!;
}

export const twoRoomProject = {
  rooms: [
    {
      name: 'Dining room',
      ceilingHeight: 96,
      length: 156,
      width: 132,
      walls: [{ side: 'length' }, { side: 'width', openings: [{ kind: 'door' }] }],
      treatment: { id: 'board-and-batten', height: 'wainscot' },
    },
    { name: 'Hallway', ceilingHeight: 96, walls: [{ length: 150, outlets: 1 }], treatment: { id: 'board-and-batten', height: 'wainscot' } },
  ],
  builtBefore1978: 'no',
  measuredBy: 'homeowner-estimate',
};
