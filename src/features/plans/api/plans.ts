// The plans endpoints, one file each; this re-export keeps older imports working.
export * from './budget-search';
export * from './create-plan';
export * from './delete-plan';
export * from './get-plan';
export * from './get-plan-result';
export * from './get-plan-versions';
export * from './keys';
export * from './list-plans';
export * from './publish-plan';
export * from './run-plan';
export * from './update-plan';
