import { mount } from '@vue/test-utils';
import { Quasar } from 'quasar';
import { describe, expect, it } from 'vitest';
import { defineComponent, ref } from 'vue';
import BaseFormError from './BaseFormError.vue';
import BaseInput from './BaseInput.vue';

/** A form as the pages write one: a number field with v-model.number and a field error. */
const Form = defineComponent({
  components: { BaseInput, BaseFormError },
  setup: () => ({ value: ref<number | null>(3100), error: ref<string | null>(null), formError: ref<string | null>(null) }),
  template: `
    <BaseInput v-model.number="value" type="number" label="Station elevation (m)" data-test="elevation" :error="error" />
    <BaseFormError :message="formError" data-test="form-error" />`,
});

describe('form fields', () => {
  it('passes v-model.number, attributes and the error message through to the input', async () => {
    const wrapper = mount(Form, { global: { plugins: [Quasar] } });
    const input = wrapper.find('input');
    expect(input.attributes('data-test')).toBe('elevation');
    await input.setValue('3250');
    expect(wrapper.vm.value).toBe(3250);
    expect(wrapper.text()).not.toContain('must be between');
    wrapper.vm.error = 'must be between −500 and 9000 m';
    await wrapper.vm.$nextTick();
    expect(wrapper.find('.q-field').classes()).toContain('q-field--error');
    expect(wrapper.text()).toContain('must be between −500 and 9000 m');
  });

  it('shows the form error banner only when there is a message', async () => {
    const wrapper = mount(Form, { global: { plugins: [Quasar] } });
    expect(wrapper.find('[data-test=form-error]').exists()).toBe(false);
    wrapper.vm.formError = 'E-mail or password is not right.';
    await wrapper.vm.$nextTick();
    expect(wrapper.find('[data-test=form-error]').attributes('role')).toBe('alert');
    expect(wrapper.find('[data-test=form-error]').text()).toBe('E-mail or password is not right.');
  });

  it('shows a number set from outside rounded, and what the user types as typed', async () => {
    const wrapper = mount(BaseInput, {
      props: { modelValue: -5.80327, rounded: true, type: 'number', label: 'Temperature lapse rate', 'onUpdate:modelValue': (v: string | number | null) => wrapper.setProps({ modelValue: Number(v) }) },
      global: { plugins: [Quasar] },
    });
    const input = wrapper.find('input');
    expect(input.element.value).toBe('-5.803');
    await input.setValue('-6.12345');
    expect(wrapper.props('modelValue')).toBe(-6.12345);
    expect(input.element.value).toBe('-6.12345');
    await wrapper.setProps({ modelValue: 1.49574 });
    expect(input.element.value).toBe('1.496');
  });
});
