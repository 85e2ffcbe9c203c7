import type { Config } from 'tailwindcss';

/**
 * Evenload's theme. Colours are CSS variables (set in app/globals.css for the light "paper" theme
 * and the dark "slate" theme) so one class works in both.
 *
 * - paper / ink: warm off-white paper and slate ink (light); deep slate and pale ink (dark).
 * - accent: one teal for actions and focus.
 * - below / on / above: the diverging scale for load deviation from target (a blue for below, a
 *   neutral for on target, an orange for above): a blue–orange pair stays distinct for the common
 *   red–green colour-vision deficiencies.
 */
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './lib/**/*.{ts,tsx}'],
  darkMode: 'media',
  theme: {
    extend: {
      colors: {
        paper: 'var(--el-paper)',
        panel: 'var(--el-panel)',
        rule: 'var(--el-rule)',
        ink: 'var(--el-ink)',
        muted: 'var(--el-muted)',
        accent: 'var(--el-accent)',
        'accent-ink': 'var(--el-accent-ink)',
        below: 'var(--el-below)',
        on: 'var(--el-on)',
        above: 'var(--el-above)',
        danger: 'var(--el-danger)',
        caution: 'var(--el-caution)',
        good: 'var(--el-good)',
      },
      fontFamily: {
        sans: ['var(--font-sans)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-mono)', 'ui-monospace', 'monospace'],
      },
      fontSize: {
        xs: ['0.75rem', { lineHeight: '1rem' }],
        sm: ['0.875rem', { lineHeight: '1.25rem' }],
        base: ['1rem', { lineHeight: '1.5rem' }],
        lg: ['1.125rem', { lineHeight: '1.75rem' }],
        xl: ['1.375rem', { lineHeight: '1.875rem' }],
        '2xl': ['1.75rem', { lineHeight: '2.25rem' }],
        '3xl': ['2.25rem', { lineHeight: '2.75rem' }],
        room: ['3rem', { lineHeight: '3.5rem' }],
        'room-lg': ['4.5rem', { lineHeight: '5rem' }],
      },
      borderRadius: { card: '0.625rem' },
    },
  },
};

export default config;
