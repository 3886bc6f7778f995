// @vitest-environment jsdom
/** The review status tag shows docs/product.md's words for each status (Names: open, questions, supported, not supported). */
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import PrimeVue from 'primevue/config';
import ReviewStatusTag from '@/components/lender/ReviewStatusTag.vue';

describe('ReviewStatusTag', () => {
  it.each([
    ['open', 'Open'],
    ['questions', 'Questions'],
    ['supported', 'Supported'],
    ['not-supported', 'Not supported'],
  ] as const)('shows %s as "%s"', (status, words) => {
    const wrapper = mount(ReviewStatusTag, { props: { status }, global: { plugins: [PrimeVue] } });
    expect(wrapper.text()).toBe(words);
    expect(wrapper.attributes('data-status')).toBe(status);
  });
});
