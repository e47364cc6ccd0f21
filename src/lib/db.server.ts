// The server's one Sequelize connection. Importing this module binds the models; it connects on first query.
import { DATABASE_URL } from 'astro:env/server';
import { connect } from '@db/models';

export const sequelize = connect(DATABASE_URL);
