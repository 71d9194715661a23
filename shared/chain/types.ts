export type {
  ChannelDefinition,
  ChannelDefinitionInput,
  ResistorDefinition,
  DividerDefinition,
  ConverterDefinition,
  IsolatorDefinition,
  CaptureDefinition,
  ReconstructionDefinition,
  EnvironmentDefinition,
  Distribution,
} from '../schemas/chain.js';

/** A design problem found without simulation; `where` names the stage and field. */
export interface ChainWarning {
  code:
    | 'over-voltage-rating'
    | 'over-voltage-derating'
    | 'over-power-rating'
    | 'over-power-derating'
    | 'converter-over-range'
    | 'converter-range-unused'
    | 'isolator-rate-exceeded'
    | 'counter-overflow'
    | 'few-counts'
    | 'rating-missing'
    | 'isolation-rating-exceeded'
    | 'isolation-distance-short'
    | 'isolation-not-checked';
  /** 'info' when a check could not be made (a rating not entered) rather than failed. */
  level: 'warning' | 'info';
  message: string;
  where: string;
}
