'use client';

export { RecordPageError as default } from '@/components/settings/record-page-error';
