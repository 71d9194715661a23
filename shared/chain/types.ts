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
    | 'isolator-rate-exceeded'
    | 'counter-overflow'
    | 'few-counts';
  message: string;
  where: string;
}
