import { describe, expect, it } from 'vitest';
import { CONTROL_CHARACTERS_MESSAGE, hasControlCharacters, safeString, text } from './common';

describe('safeString: the one string schema of contracts', () => {
  it('refuses NUL and the other control characters, keeps tabs and line breaks', () => {
    for (const bad of ['\u0000', 'a\u0007', '\u001b[2J', 'x\u007f', '\u0085', '\u009f', 'a\rb', '\u000b', '\u000c']) {
      expect(hasControlCharacters(bad), JSON.stringify(bad)).toBe(true);
      expect(safeString().safeParse(bad).error?.issues[0]?.message, JSON.stringify(bad)).toBe(CONTROL_CHARACTERS_MESSAGE);
    }
    for (const ok of ['plain', 'tab\there', 'two\nlines', 'crlf\r\nlines', 'Ω µ °C ±', 'emoji 🔋', '']) {
      expect(safeString().parse(ok)).toBe(ok);
    }
  });

  it('the control-character message comes first, before length and format checks', () => {
    expect(text(5).safeParse('\u0000 far too long').error?.issues[0]?.message).toBe(CONTROL_CHARACTERS_MESSAGE);
  });
});
