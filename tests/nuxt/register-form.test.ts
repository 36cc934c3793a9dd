import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import AccountRegisterForm from '~/components/account/AccountRegisterForm.vue'
import AppBottomNav from '~/components/app/AppBottomNav.vue'

describe('AccountRegisterForm', () => {
  it('warns about a short password and refuses to submit it', async () => {
    const wrapper = await mountSuspended(AccountRegisterForm)
    await wrapper.find('#reg-password').setValue('short')
    expect(wrapper.find('#reg-password-hint').classes()).toContain('text-danger')
    await wrapper.find('form').trigger('submit')
    expect(wrapper.find('[role="alert"]').text()).toContain('at least 10 characters')
  })

  it('locks the e-mail field to the invited address', async () => {
    const wrapper = await mountSuspended(AccountRegisterForm, { props: { presetEmail: 'invitee@test.example', invitationToken: 'x'.repeat(20) } })
    const email = wrapper.find('#reg-email')
    expect((email.element as HTMLInputElement).value).toBe('invitee@test.example')
    expect(email.attributes('readonly')).toBeDefined()
  })
})

describe('AppBottomNav', () => {
  it('lists the five sections in the order of the work', async () => {
    const wrapper = await mountSuspended(AppBottomNav)
    expect(wrapper.findAll('a').map(a => a.text())).toEqual(['Bench', 'Procedures', 'Jobs', 'Rigs', 'More'])
  })
})
