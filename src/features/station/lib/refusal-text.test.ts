import { describe, expect, it } from 'vitest';
import { describeRefusal, reasonNamer } from './refusal-text';

const reasons = [{ code: 'hold_customer', name: 'Customer asked to wait', nameZh: '客户要求暂停' }];
const time = (iso: unknown) => String(iso);

describe('hold reasons are named in the tablet language, never shown as codes', () => {
  it('names a known reason in English and in Chinese', () => {
    const en = describeRefusal('en', 'on_hold', { holdReason: 'hold_customer' }, time, reasonNamer(reasons, 'en'));
    expect(en.detail).toContain('Customer asked to wait');
    expect(en.detail).not.toContain('hold_customer');
    const zh = describeRefusal('zh-CN', 'on_hold', { holdReason: 'hold_customer' }, time, reasonNamer(reasons, 'zh-CN'));
    expect(zh.detail).toContain('客户要求暂停');
  });
  it('keeps a free-text hold note as typed', () => {
    expect(describeRefusal('en', 'on_hold', { holdReason: 'waiting for the blue' }, time, reasonNamer(reasons, 'en')).detail).toContain('waiting for the blue');
  });
});
