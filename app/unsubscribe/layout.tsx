// The public unsubscribe page wears the sign-in pages' frame.
export { default } from '../(auth)/layout';
