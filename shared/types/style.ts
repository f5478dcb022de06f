import type { StyleFamily } from '../constants/styles';

export type StyleDto = {
  id: number;
  slug: string;
  name: string;
  family: StyleFamily;
  description: string;
  typicalAgingDays: { min: number; max: number };
};
