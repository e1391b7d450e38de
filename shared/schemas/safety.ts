import { z } from 'zod'

/** A phone number as people write it: digits, spaces, +, -, brackets; empty clears it. */
export const emergencyNumberSchema = z.object({
  emergencyNumber: z.string({ error: 'Write the number or leave it empty' }).trim()
    .max(20, 'At most 20 characters')
    .regex(/^[+\d][\d\s\-()]*$|^$/, 'Use digits, spaces, +, - and brackets only')
    .nullable()
    .transform(value => value || null),
})

export const painFlagEmailsSchema = z.object({
  painFlagEmails: z.boolean({ error: 'Choose on or off' }),
})
