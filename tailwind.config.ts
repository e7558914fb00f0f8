import type { Config } from 'tailwindcss'

// Rungwise design tokens: defined once here, never as hex values in components.
export default {
  content: ['./stores/**/*.ts', './shared/**/*.ts'],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: '#12323A', soft: '#2A4B53' },
        paper: '#F6F4EE',
        panel: '#FFFFFF',
        rule: '#D9D4C7',
        copper: { DEFAULT: '#B8612A', soft: '#F3E3D6', ink: '#8F4617' },
        slate: { DEFAULT: '#5B6B70' },
        pass: '#2F7D4F',
        risk: { DEFAULT: '#B7862B', ink: '#7F5C14' },
        fail: '#B23A3A',
        // Candidate hues for charts after ink, copper and slate (utils/chartPalette.ts reads these)
        chart: { moss: '#5E7A3A', plum: '#7A4A6E', teal: '#2F7F86', sand: '#A08A5A', brick: '#8A4B3C', steel: '#4F6D8F', olive: '#8A8A3A' }
      },
      fontFamily: {
        sans: ['Lexend', 'ui-sans-serif', 'system-ui', 'sans-serif']
      },
      fontSize: {
        'xs': ['0.75rem', { lineHeight: '1.1rem' }],
        'sm': ['0.8125rem', { lineHeight: '1.25rem' }],
        'base': ['0.9375rem', { lineHeight: '1.5rem' }],
        'lg': ['1.125rem', { lineHeight: '1.6rem' }],
        'xl': ['1.375rem', { lineHeight: '1.9rem' }],
        '2xl': ['1.75rem', { lineHeight: '2.25rem' }]
      },
      spacing: { rail: '13rem', bar: '3.25rem' },
      borderRadius: { card: '0.5rem' },
      boxShadow: { card: '0 1px 2px rgba(18, 50, 58, 0.06)' }
    }
  }
} satisfies Config
