import { describe, expect, it } from 'vitest';
import { personLang, stationTexts } from './station-lang';

describe('the language a person gets on the tablet', () => {
  it('follows the person’s saved choice first, then what this tablet remembers, then the tablet setting', () => {
    expect(personLang({ server: 'zh-CN', remembered: 'en', tablet: 'en' })).toBe('zh-CN');
    expect(personLang({ server: null, remembered: 'zh-CN', tablet: 'en' })).toBe('zh-CN');
    expect(personLang({ server: undefined, remembered: undefined, tablet: 'zh-CN' })).toBe('zh-CN');
    expect(personLang({ server: 'fr', remembered: 'xx', tablet: 'en' })).toBe('en');
  });
});

describe('station texts', () => {
  const s = { name: 'Curing oven', nameZh: '烤炉', instructions: 'Load trays flat.', instructionsZh: '', safetyNotes: 'Hot.', safetyNotesZh: '很烫。' };
  it('are Chinese on a Chinese screen where the station has them, English otherwise', () => {
    expect(stationTexts(s, 'zh-CN')).toEqual({ name: '烤炉', instructions: 'Load trays flat.', safetyNotes: '很烫。' });
    expect(stationTexts(s, 'en')).toEqual({ name: 'Curing oven', instructions: 'Load trays flat.', safetyNotes: 'Hot.' });
  });
});
