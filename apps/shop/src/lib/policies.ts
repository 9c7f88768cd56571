import type { User } from '@benchwright/contracts';

// Mirrors the server's checks for what to show; the server still decides.
export const isStaff = (u: User | null | undefined) => u?.role === 'owner' || u?.role === 'builder';
export const canSeeBoard = isStaff;
export const canSeeRequests = (u: User | null | undefined) => u?.role === 'owner';
export const canInviteBuilders = (u: User | null | undefined) => u?.role === 'owner';
export const canAssignJobs = (u: User | null | undefined) => u?.role === 'owner';
export const canRelayoutJobs = (u: User | null | undefined) => u?.role === 'owner';
export const canSeePayments = (u: User | null | undefined) => u?.role === 'owner';
export const canSeeMail = (u: User | null | undefined) => u?.role === 'owner';
export const canSeeOverview = (u: User | null | undefined) => u?.role === 'owner';
export const canEditPriceBook = (u: User | null | undefined) => u?.role === 'owner';
export const canChangeSettings = (u: User | null | undefined) => u?.role === 'owner';
export const canSeeClients = (u: User | null | undefined) => u?.role === 'owner';
