import { mount } from '@vue/test-utils'
import { describe, expect, it, vi } from 'vitest'
import AppPasswordField from '@/components/AppPasswordField.vue'

// The meter under a new-password field judges by the rule the server applies on save
// (shared/auth/password-strength.ts, zxcvbn with its offline lists).

function mountField(autocomplete: 'new-password' | 'current-password', relatedWords?: string[]) {
  return mount(AppPasswordField, {
    props: {
      modelValue: '',
      label: 'Password',
      inputId: 'pw',
      autocomplete,
      ...(relatedWords ? { relatedWords } : {}),
    },
  })
}

async function typePassword(wrapper: ReturnType<typeof mountField>, password: string) {
  await wrapper.setProps({ modelValue: password })
  // The checker loads on first use and judges a moment after the last keystroke.
  await vi.waitFor(
    () => expect(wrapper.get('[data-testid="password-strength"]').text()).toContain('Strength'),
    { timeout: 5000 },
  )
  return wrapper.get('[data-testid="password-strength"]').text()
}

describe('the password strength meter', () => {
  it('calls a password from the common lists what it is, and says what to do', async () => {
    // Source: "password" heads every published leaked-password list (zxcvbn's included).
    const wrapper = mountField('new-password')
    const text = await typePassword(wrapper, 'password1234')
    expect(text).toMatch(/Strength [01] of 4/)
    expect(text).toContain('on lists of common passwords')
    expect(text).toContain('longer phrase')
  })

  it('accepts a phrase of unrelated words', async () => {
    // Source: zxcvbn README, score 4 "very unguessable": four random words, common practice
    // for passphrases (NIST SP 800-63B §5.1.1.2 favours long memorised secrets).
    const text = await typePassword(mountField('new-password'), 'quartz lantern orbit meadow')
    expect(text).toContain('Strength 4 of 4: Very hard to guess')
  })

  it("counts the person's own name and address as known to an attacker", async () => {
    // Source: zxcvbn README (user inputs: words an attacker would try first score low).
    const stranger = await typePassword(mountField('new-password'), 'brightwateralexandra')
    expect(stranger).toContain('Hard enough to guess')
    const own = await typePassword(
      mountField('new-password', ['alexandra.brightwater@example.org']),
      'brightwateralexandra',
    )
    expect(own).toContain('too easy to guess')
  })

  it('holds a short password to the length rule, however random it looks', async () => {
    // Source: NIST SP 800-63B §3.1.1.2 (a length floor; at least 12 characters here).
    const text = await typePassword(mountField('new-password'), 'kX9#vQ2$mZ')
    expect(text).toContain('Use at least 12 characters')
  })

  it('ties the meter to the input for screen readers, and shows none for a current password', async () => {
    const fresh = mountField('new-password')
    expect(fresh.get('input').attributes('aria-describedby')).toBe('pw-strength')
    expect(fresh.find('#pw-strength').exists()).toBe(true)
    const current = mountField('current-password')
    expect(current.find('[data-testid="password-strength"]').exists()).toBe(false)
    expect(current.get('input').attributes('aria-describedby')).toBeUndefined()
  })
})
