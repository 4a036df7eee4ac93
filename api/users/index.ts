export { acceptInvitation } from './accept-invitation';
export { inviteUser, reissueInvitation, type InviteUserInput, type InviteUserResult } from './invite-user';
export {
  generateInvitationToken,
  hashInvitationToken,
  invitationUrl,
  INVITATION_LIFETIME_MS,
} from './invitation-token';
export { getUser, listUsers, type ListUsersQuery } from './list-users';
export { updateUser, type UpdateUserInput } from './update-user';
export { toUserView, type UserView } from './user-view';
