export { Configurator, defaultsOf, specFrom, type ConfiguratorProps } from './configurator';
export { SpecForm } from './spec-form';
export { designQueryOptions, getDesign, useDesign, usePreview } from './api';
export { issueMap, IssuesProvider, plainPath, specPath } from './issues';
