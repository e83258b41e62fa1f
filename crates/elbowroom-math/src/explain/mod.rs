//! Why a_w is what it is: the coefficients a_w of the permutahedral class
//! (the Hessenberg class of the default h, ℓ(w) = n − 1) explained by reduced words.
//!
//! - [`formula`]: the reduced-word formula a_w = (1/(n−1)!) Σ_{a ∈ Red(w)} A_{c(a)}
//!   (Nadeau–Tewari, IMRN 2023), by the distribution of contents, sized before it starts.
//! - [`monomials`]: the same number through the monomials of S_w and Postnikov's
//!   formula DS_n(x^c) = (−1)^{|S|} β_n(S).
//! - [`rules`]: the rules that give a_w at once where they apply (parking words,
//!   Grassmannian w with its standard tableaux, Coxeter elements).
//! - [`symmetry`]: a_w = a_{w^{-1}} = a_{w0 w w0}, the cyclic orbit and its sum, h*.
//! - [`content_words`]: the reduced words of w of one content, counted, paged and ranked.
//! - [`explanation`]: all of the above for one w, for the window and the commands.
//! - [`qvalue`]: the q-analogue a_w(q) through the algebra K_n(q).

pub mod content_words;
pub mod explanation;
pub mod formula;
pub mod monomials;
pub mod qvalue;
pub mod rules;
pub mod symmetry;
