import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { LengthField } from './LengthField';

const render = (props: Partial<Parameters<typeof LengthField>[0]> = {}) =>
  renderToStaticMarkup(<LengthField id="len" label="Room length" value="" onChange={() => {}} units="imperial" kind="room-length" {...props} />);

describe('LengthField', () => {
  // Source: 1 ft = 12 in (NIST SP 811 Appendix B); "= 5' 0"" is the issue's own read-back example.
  it('says under the field how the length was read', () => {
    const html = render({ value: '60' });
    expect(html).toContain('id="len-readback"');
    expect(html).toContain(`= 5&#x27; 0&quot;`);
    expect(html).toMatch(/aria-describedby="len-readback"/);
  });

  it('starts empty with an example placeholder and no read-back', () => {
    const html = render();
    expect(html).toMatch(/placeholder="e.g. [^"]+"/);
    expect(html).toContain('value=""');
    expect(html).not.toContain('len-readback');
  });

  it('marks a required field in words and for assistive tech', () => {
    const html = render({ required: true });
    expect(html).toContain('(required)');
    expect(html).toContain('aria-required="true"');
  });

  // Source: 1200 in = 100 ft (NIST SP 811 Appendix B); the issue asks for "at most 100 ft", not inches.
  it('shows an error in the homeowner units, tied to the input, with a red border', () => {
    const html = render({ value: '2000', error: 'Room length must be at most 1200 in.' });
    expect(html).toContain('aria-invalid="true"');
    expect(html).toMatch(/aria-describedby="len-error[^"]*"/);
    expect(html).toContain('id="len-error"');
    expect(html).toContain('Room length must be at most 100 ft.');
    expect(html).toContain('border-brick');
  });

  // Plausible room sizes: common practice, no source.
  it('asks inches or feet for a room length of 12, with two buttons', () => {
    const html = render({ value: '12' });
    expect(html).toContain('Inches or feet?');
    expect(html).toContain('>12 in</button>');
    expect(html).toContain('>12 ft</button>');
  });

  it('asks a metric firm millimetres or metres', () => {
    const html = render({ value: '4', units: 'metric' });
    expect(html).toContain('Millimetres or metres?');
    expect(html).toContain('>4 m</button>');
  });
});
