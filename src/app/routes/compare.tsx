/** The comparison page lives with its feature (src/features/compare). */
export { default } from '@/features/compare/components/compare-page';
