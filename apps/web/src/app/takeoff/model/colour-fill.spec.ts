import { colourFill } from './colour-fill';

describe('colour names to fills', () => {
  it('gives the common colour words their own tones, wherever the word sits in the name', () => {
    expect(colourFill('Slate grey')).toBe(colourFill('grey'));
    expect(colourFill('Traffic Red')).toBe('#b8322c');
    expect(colourFill('signal yellow')).toBe('#e8c229');
    expect(colourFill('Black')).toBe('#262626');
    expect(colourFill('Racing green')).toBe('#3f8f4f');
    expect(colourFill('Dark blue')).toBe('#2f62a8');
  });

  it('does not read a colour word inside another word', () => {
    // "Redwood" is not red: only whole words map to the fixed tones.
    expect(colourFill('Bored')).not.toBe('#b8322c');
  });

  it('gives any other name a stable generated hue, different for different names', () => {
    const a = colourFill('Heron');
    expect(a).toMatch(/^#[0-9a-f]{6}$/);
    expect(colourFill('Heron')).toBe(a);
    expect(colourFill('heron ')).toBe(a);
    expect(colourFill('Marram')).not.toBe(a);
  });
});
