//! A list of entries with unique ids — materials, gauge catalogs, string kinds — looked up by id
//! with a "did you mean" on a miss, and extended by a user's own files without replacing
//! anything shipped.

use crate::error::{did_you_mean, Error, Result};
use crate::input::id::Id;

/// An entry a [`Registry`] can hold.
pub trait Entry {
    /// What one entry is called in messages, e.g. `material`.
    const NOUN: &'static str;
    /// What several are called, e.g. `materials`.
    const PLURAL: &'static str;
    /// The entry's unique id.
    fn id(&self) -> &Id;
}

/// Entries with unique ids, in file order.
#[derive(Debug, Clone)]
pub struct Registry<T> {
    list: Vec<T>,
}

impl<T> Default for Registry<T> {
    fn default() -> Self {
        Registry { list: Vec::new() }
    }
}

impl<T: Entry> Registry<T> {
    /// All entries in file order.
    pub fn all(&self) -> &[T] {
        &self.list
    }

    /// Whether an entry has this id.
    pub fn contains(&self, id: &str) -> bool {
        self.list.iter().any(|entry| entry.id().as_str() == id)
    }

    /// The entry with this id, or an error that suggests the closest id.
    pub fn get(&self, id: &str) -> Result<&T> {
        if let Some(found) = self.list.iter().find(|entry| entry.id().as_str() == id) {
            return Ok(found);
        }
        let ids = || self.list.iter().map(|entry| entry.id().as_str());
        let err = Error::input(format!("unknown {} `{id}`", T::NOUN));
        Err(match did_you_mean(id, ids()) {
            Some(best) => err.help(format!("did you mean `{best}`?")),
            None => err.help(format!(
                "known {}: {}",
                T::PLURAL,
                ids().collect::<Vec<_>>().join(", ")
            )),
        })
    }

    /// Adds the entries of `more` (e.g. from a user's file), refusing an id that is already taken.
    pub fn extend(&mut self, more: Registry<T>) -> Result<()> {
        for entry in more.list {
            if self.contains(entry.id().as_str()) {
                return Err(Error::input(format!(
                    "{} `{}` is already defined",
                    T::NOUN,
                    entry.id()
                ))
                .help(format!("choose a new id for your own {}", T::NOUN)));
            }
            self.list.push(entry);
        }
        Ok(())
    }

    /// Appends an entry whose id the caller has checked is new.
    pub(crate) fn push(&mut self, entry: T) {
        self.list.push(entry);
    }
}
