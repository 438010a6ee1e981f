import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { newRoom } from './draft';
import { RoomsStep } from './RoomsStep';

describe('RoomsStep', () => {
  it('shows a message about the project as a whole, such as one too big for an online estimate', () => {
    const message = 'This project is too big for one online estimate: 130 walls (at most 120).';
    const html = renderToStaticMarkup(
      <RoomsStep rooms={[newRoom('imperial', 'Hallway')]} units="imperial" errors={{ 'project.rooms': message }} onChange={() => {}} />,
    );
    expect(html).toContain(`role="alert">${message}</p>`);
  });
});
