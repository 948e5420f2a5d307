// Nothing but a comment: no module.
