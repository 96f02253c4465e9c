/** Every client URL, in one place. */
export const paths = {
  home: '/',
  signIn: '/sign-in',
} as const;
